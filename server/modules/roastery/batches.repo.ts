import { and, asc, eq, gte, sql } from 'drizzle-orm';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { Db, DbOrTx } from '../../db/client';
import { batches, lots, stockMovements, users } from '../../db/schema/index';
import { loadShopSettings } from '../settings';

export interface NewBatch {
  /** The client's id for the batch, when it sent one; otherwise the database makes one. */
  id?: string;
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

/** Thrown inside the transaction to roll back the stock it took: the batch id is already recorded. */
class DuplicateBatch extends Error {}

/** What every batch of a lot at a level adds up to. */
async function historyOf(db: DbOrTx, lotId: string, roastLevel: RoastLevel) {
  const [history] = await db
    .select({
      batchCount: sql<number>`count(*)`.mapWith(Number),
      greenGramsIn: sql<number>`coalesce(sum(${batches.greenGramsIn}), 0)`.mapWith(Number),
      roastedGramsOut: sql<number>`coalesce(sum(${batches.roastedGramsOut}), 0)`.mapWith(Number),
    })
    .from(batches)
    .where(and(eq(batches.lotId, lotId), eq(batches.roastLevel, roastLevel)));
  return history!;
}

async function recordRest(tx: DbOrTx, batch: NewBatch, id: string, stockGrams: number): Promise<RecordedBatch> {
  await tx.insert(stockMovements).values({
    lotId: batch.lotId,
    deltaGrams: -batch.greenGramsIn,
    reason: 'roast',
    note: `Batch roasted ${batch.roastDate}`,
    batchId: id,
    actorId: batch.operatorId,
  });
  return { id, stockGrams, history: await historyOf(tx, batch.lotId, batch.roastLevel) };
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
     * update matches only while stock covers the green: 'short' and nothing written otherwise. A
     * batch id already recorded (a retried request) writes nothing and answers 'duplicate'.
     */
    async record(batch: NewBatch): Promise<RecordedBatch | 'short' | 'duplicate'> {
      try {
        return await db.transaction(async (tx) => {
          const [lot] = await tx
            .update(lots)
            .set({ stockGrams: sql`${lots.stockGrams} - ${batch.greenGramsIn}` })
            .where(and(eq(lots.id, batch.lotId), gte(lots.stockGrams, batch.greenGramsIn)))
            .returning({ stockGrams: lots.stockGrams });
          if (!lot) return 'short';
          // A concurrent request with the same id waits here until the first commits, then finds it.
          const [row] = await tx.insert(batches).values(batch).onConflictDoNothing({ target: batches.id }).returning({ id: batches.id });
          if (!row) throw new DuplicateBatch();
          return await recordRest(tx, batch, row.id, lot.stockGrams);
        });
      } catch (error) {
        if (error instanceof DuplicateBatch) return 'duplicate';
        throw error;
      }
    },

    /** A recorded batch as its creation answered, for a retried request with the same id. */
    async find(id: string) {
      const [row] = await db.select().from(batches).where(eq(batches.id, id));
      if (!row) return undefined;
      const [lot] = await db.select({ stockGrams: lots.stockGrams, code: lots.code }).from(lots).where(eq(lots.id, row.lotId));
      return { batch: row, lotCode: lot!.code, stockGrams: lot!.stockGrams, history: await historyOf(db, row.lotId, row.roastLevel) };
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
