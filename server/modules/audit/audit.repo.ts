import type { DbOrTx } from '../../db/client';
import { auditLog } from '../../db/schema/index';

export function createAuditRepo(db: DbOrTx) {
  return {
    async insert(entry: typeof auditLog.$inferInsert) {
      await db.insert(auditLog).values(entry);
    },
  };
}

export type AuditRepo = ReturnType<typeof createAuditRepo>;
