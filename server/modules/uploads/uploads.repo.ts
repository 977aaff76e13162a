import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { uploads } from '../../db/schema/index';

export function createUploadsRepo(db: Db) {
  return {
    async findById(id: string) {
      const [row] = await db
        .select({ kind: uploads.kind, storageKey: uploads.storageKey, contentType: uploads.contentType, originalName: uploads.originalName })
        .from(uploads)
        .where(eq(uploads.id, id));
      return row;
    },
  };
}

export type UploadsRepo = ReturnType<typeof createUploadsRepo>;
