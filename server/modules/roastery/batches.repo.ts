import { and, asc, eq, gte, sql } from 'drizzle-orm';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { Db } from '../../db/client';
import { batches, lots, stockMovements, users } from '../../db/schema/index';
import { loadShopSettings } from '../settings/settings.repo';

export interface NewBatch {
  roastDate: string;
  lotId: string;
  roastLevel: RoastLevel;
  greenGramsIn: number;
  roastedGramsOut: number;
  totalSeconds: number | null;
  firstCrackSeconds: number | null;
  lossPct: number;
  withinExpected: boolean;
  notes: string;
  operatorId: string;
}

export interface RecordedBatch {
  id: string;
  stockGrams: number;
  /** Every batch of the lot at the level, this one included. */
  history: { batchCount: number; greenGramsIn: number; roastedGramsOut: number };
}

export function createBatchesRepo(db: Db) {
  return {
    shopSettings: () => loadShopSettings(db),

    async lotIdOf(code: string): Promise<string | undefined> {
      const [row] = await db.select({ id: lots.id }).from(lots).where(eq(lots.code, code));
      return row?.id;
    },

    /**
     * Records the batch and takes its green out of the lot's stock, in one transaction. The stock
     * update matches only while stock covers the green: 'short' and nothing written otherwise.
     */
    async record(batch: NewBatch): Promise<RecordedBatch | 'short'> {
      return db.transaction(async (tx) => {
        const [lot] = await tx
          .update(lots)
          .set({ stockGrams: sql`${lots.stockGrams} - ${batch.greenGramsIn}` })
          .where(and(eq(lots.id, batch.lotId), gte(lots.stockGrams, batch.greenGramsIn)))
          .returning({ stockGrams: lots.stockGrams });
        if (!lot) return 'short';
        const [row] = await tx.insert(batches).values(batch).returning({ id: batches.id });
        const id = row!.id;
        await tx.insert(stockMovements).values({
          lotId: batch.lotId,
          deltaGrams: -batch.greenGramsIn,
          reason: 'roast',
          note: `Batch roasted ${batch.roastDate}`,
          batchId: id,
          actorId: batch.operatorId,
        });
        const [history] = await tx
          .select({
            batchCount: sql<number>`count(*)`.mapWith(Number),
            greenGramsIn: sql<number>`sum(${batches.greenGramsIn})`.mapWith(Number),
            roastedGramsOut: sql<number>`sum(${batches.roastedGramsOut})`.mapWith(Number),
          })
          .from(batches)
          .where(and(eq(batches.lotId, batch.lotId), eq(batches.roastLevel, batch.roastLevel)));
        return { id, stockGrams: lot.stockGrams, history: history! };
      });
    },

    /** A roast day's batches in the order they were recorded, with lot and operator. */
    async onDay(roastDate: string) {
      return db
        .select({
          id: batches.id,
          roastDate: batches.roastDate,
          lotCode: lots.code,
          lotName: lots.name,
          roastLevel: batches.roastLevel,
          greenGramsIn: batches.greenGramsIn,
          roastedGramsOut: batches.roastedGramsOut,
          totalSeconds: batches.totalSeconds,
          firstCrackSeconds: batches.firstCrackSeconds,
          lossPct: batches.lossPct,
          withinExpected: batches.withinExpected,
          operatorName: users.name,
          notes: batches.notes,
          createdAt: batches.createdAt,
        })
        .from(batches)
        .innerJoin(lots, eq(lots.id, batches.lotId))
        .leftJoin(users, eq(users.id, batches.operatorId))
        .where(eq(batches.roastDate, roastDate))
        .orderBy(asc(batches.createdAt), asc(batches.id));
    },
  };
}

export type BatchesRepo = ReturnType<typeof createBatchesRepo>;
