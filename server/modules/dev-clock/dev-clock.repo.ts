import { sql } from 'drizzle-orm';
import type { Db } from '../../db/client';

export function createDevClockRepo(db: Db) {
  return {
    /** Tells every process listening on `channel` (workers in other processes) the clock's new offset. */
    async broadcast(channel: string, offsetMs: number): Promise<void> {
      await db.execute(sql`select pg_notify(${channel}, ${String(offsetMs)})`);
    },
  };
}

export type DevClockRepo = ReturnType<typeof createDevClockRepo>;
