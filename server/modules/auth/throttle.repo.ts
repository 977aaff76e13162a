import { and, eq, gt, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { throttleCounters } from '../../db/schema/index';

/** Fixed-window hit counters in PostgreSQL, so every app process counts against the same limit. */
export function createThrottleRepo(db: DbOrTx) {
  return {
    /** Counts one hit; a window that has ended starts again at 1. */
    async hit(key: string, windowMs: number, now: Date): Promise<{ hits: number; resetAt: Date }> {
      const resetAt = new Date(now.getTime() + windowMs);
      const [row] = await db
        .insert(throttleCounters)
        .values({ key, hits: 1, resetAt })
        .onConflictDoUpdate({
          target: throttleCounters.key,
          set: {
            hits: sql`case when ${throttleCounters.resetAt} <= ${now} then 1 else ${throttleCounters.hits} + 1 end`,
            resetAt: sql`case when ${throttleCounters.resetAt} <= ${now} then ${resetAt} else ${throttleCounters.resetAt} end`,
          },
        })
        .returning({ hits: throttleCounters.hits, resetAt: throttleCounters.resetAt });
      return row!;
    },

    /** Takes back one hit of a window still running (a request that turned out not to count). */
    async unhit(key: string, now: Date): Promise<void> {
      await db
        .update(throttleCounters)
        .set({ hits: sql`greatest(${throttleCounters.hits} - 1, 0)` })
        .where(and(eq(throttleCounters.key, key), gt(throttleCounters.resetAt, now)));
    },

    async read(key: string, now: Date): Promise<{ hits: number; resetAt: Date } | undefined> {
      const [row] = await db
        .select({ hits: throttleCounters.hits, resetAt: throttleCounters.resetAt })
        .from(throttleCounters)
        .where(and(eq(throttleCounters.key, key), gt(throttleCounters.resetAt, now)));
      return row;
    },

    async clear(key: string): Promise<void> {
      await db.delete(throttleCounters).where(eq(throttleCounters.key, key));
    },

    async purgeEnded(now: Date): Promise<void> {
      await db.delete(throttleCounters).where(sql`${throttleCounters.resetAt} <= ${now}`);
    },
  };
}

export type ThrottleRepo = ReturnType<typeof createThrottleRepo>;
