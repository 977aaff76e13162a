import { and, asc, desc, eq, gte, inArray, sql } from 'drizzle-orm';
import { useReasons } from '@shared/domain/stock-cover';
import type { StockAdjustment } from '@shared/schemas/lots';
import type { Db } from '../../db/client';
import { lotPriceBreaks, lots, stockMovements, uploads, users } from '../../db/schema/index';
import type { UploadKind } from '../../db/schema/enums';

type LotRow = typeof lots.$inferSelect;
/** Lot columns staff write (the code only on create; stock only through movements). */
export type LotColumns = Omit<typeof lots.$inferInsert, 'id' | 'stockGrams' | 'createdAt' | 'updatedAt'>;
export type PriceBreak = { minGrams: number; pricePerKgCents: number };

export interface NewUpload {
  kind: UploadKind;
  storageKey: string;
  contentType: string;
  byteSize: number;
  originalName: string;
}

/** The Roastery's reads and writes of lots, their files and their stock; listed or not. */
export function createLotsAdminRepo(db: Db) {
  async function priceBreaksOf(lotId: string) {
    return db
      .select({ minGrams: lotPriceBreaks.minGrams, pricePerKgCents: lotPriceBreaks.pricePerKgCents })
      .from(lotPriceBreaks)
      .where(eq(lotPriceBreaks.lotId, lotId))
      .orderBy(asc(lotPriceBreaks.minGrams));
  }

  return {
    async findByCode(code: string): Promise<{ lot: LotRow; priceBreaks: PriceBreak[]; files: { id: string; kind: UploadKind }[] } | undefined> {
      const lot = await db.query.lots.findFirst({ where: eq(lots.code, code) });
      if (!lot) return undefined;
      const [priceBreaks, files] = await Promise.all([
        priceBreaksOf(lot.id),
        db.select({ id: uploads.id, kind: uploads.kind }).from(uploads).where(eq(uploads.lotId, lot.id)).orderBy(asc(uploads.position), asc(uploads.createdAt)),
      ]);
      return { lot, priceBreaks, files };
    },

    async lotIdOf(code: string): Promise<string | undefined> {
      const [row] = await db.select({ id: lots.id }).from(lots).where(eq(lots.code, code));
      return row?.id;
    },

    /** Inserts the lot and its price breaks; undefined when the code is taken. */
    async create(columns: LotColumns & { code: string }, priceBreaks: PriceBreak[]): Promise<string | undefined> {
      return db.transaction(async (tx) => {
        const [row] = await tx.insert(lots).values(columns).onConflictDoNothing({ target: lots.code }).returning({ id: lots.id });
        if (!row) return undefined;
        if (priceBreaks.length > 0) await tx.insert(lotPriceBreaks).values(priceBreaks.map((priceBreak) => ({ ...priceBreak, lotId: row.id })));
        return row.id;
      });
    },

    /** Changes the given columns and, when given, replaces the price breaks, in one transaction. */
    async update(lotId: string, columns: Partial<LotColumns>, priceBreaks: PriceBreak[] | undefined): Promise<void> {
      await db.transaction(async (tx) => {
        await tx
          .update(lots)
          .set({ ...columns })
          .where(eq(lots.id, lotId));
        if (priceBreaks) {
          await tx.delete(lotPriceBreaks).where(eq(lotPriceBreaks.lotId, lotId));
          if (priceBreaks.length > 0) await tx.insert(lotPriceBreaks).values(priceBreaks.map((priceBreak) => ({ ...priceBreak, lotId })));
        }
      });
    },

    /** Records a new photo after the lot's last one. */
    async addPhoto(lotId: string, upload: NewUpload, uploadedBy: string) {
      return db.transaction(async (tx) => {
        // One photo insert at a time per lot, so two uploads never share a position.
        await tx.select({ id: lots.id }).from(lots).where(eq(lots.id, lotId)).for('update');
        const [last] = await tx
          .select({ position: sql<number>`coalesce(max(${uploads.position}) + 1, 0)`.mapWith(Number) })
          .from(uploads)
          .where(and(eq(uploads.lotId, lotId), eq(uploads.kind, 'photo')));
        const [row] = await tx
          .insert(uploads)
          .values({ ...upload, lotId, uploadedBy, position: last?.position ?? 0 })
          .returning({ id: uploads.id });
        return row!.id;
      });
    },

    /** Records the lot's spec sheet in place of any earlier one; returns the storage keys no longer used. */
    async replaceSpecSheet(lotId: string, upload: NewUpload, uploadedBy: string) {
      return db.transaction(async (tx) => {
        const replaced = await tx
          .delete(uploads)
          .where(and(eq(uploads.lotId, lotId), eq(uploads.kind, 'spec_sheet')))
          .returning({ storageKey: uploads.storageKey });
        const [row] = await tx
          .insert(uploads)
          .values({ ...upload, lotId, uploadedBy })
          .returning({ id: uploads.id });
        return { id: row!.id, replacedKeys: replaced.map((file) => file.storageKey) };
      });
    },

    /** Deletes one of the lot's photos; returns its storage key, or undefined when the lot has no such photo. */
    async deletePhoto(lotId: string, uploadId: string): Promise<string | undefined> {
      const [row] = await db
        .delete(uploads)
        .where(and(eq(uploads.id, uploadId), eq(uploads.lotId, lotId), eq(uploads.kind, 'photo')))
        .returning({ storageKey: uploads.storageKey });
      return row?.storageKey;
    },

    /**
     * Moves the lot's stock and records why, in one transaction. The update only matches while the
     * result stays at zero or above: 'no_lot' or 'below_zero' when nothing changed.
     */
    async adjustStock(code: string, adjustment: StockAdjustment, actorId: string): Promise<{ stockGrams: number } | 'no_lot' | 'below_zero'> {
      return db.transaction(async (tx) => {
        const [moved] = await tx
          .update(lots)
          .set({ stockGrams: sql`${lots.stockGrams} + ${adjustment.deltaGrams}` })
          .where(and(eq(lots.code, code), gte(sql`${lots.stockGrams} + ${adjustment.deltaGrams}`, 0)))
          .returning({ id: lots.id, stockGrams: lots.stockGrams });
        if (!moved) {
          const [exists] = await tx.select({ id: lots.id }).from(lots).where(eq(lots.code, code));
          return exists ? 'below_zero' : 'no_lot';
        }
        await tx.insert(stockMovements).values({
          lotId: moved.id,
          deltaGrams: adjustment.deltaGrams,
          reason: adjustment.reason,
          note: adjustment.note,
          actorId,
        });
        return { stockGrams: moved.stockGrams };
      });
    },

    /** The lot's stock movements, newest first, with who made each by hand. */
    async movements(lotId: string, limit: number) {
      return db
        .select({
          id: stockMovements.id,
          deltaGrams: stockMovements.deltaGrams,
          reason: stockMovements.reason,
          note: stockMovements.note,
          orderId: stockMovements.orderId,
          batchId: stockMovements.batchId,
          actorName: users.name,
          createdAt: stockMovements.createdAt,
        })
        .from(stockMovements)
        .leftJoin(users, eq(users.id, stockMovements.actorId))
        .where(eq(stockMovements.lotId, lotId))
        .orderBy(desc(stockMovements.createdAt), desc(stockMovements.id))
        .limit(limit);
    },

    /**
     * Every lot's stock, reorder point and grams sold or roasted since `since`: the net of those
     * movements, so a checkout that expired (its reservation handed back as a positive 'sale')
     * counts as no use at all.
     */
    async greenStock(since: Date) {
      const used = db
        .select({
          lotId: stockMovements.lotId,
          usedGrams: sql<number>`greatest(sum(-${stockMovements.deltaGrams}), 0)`.mapWith(Number).as('used_grams'),
        })
        .from(stockMovements)
        .where(and(inArray(stockMovements.reason, [...useReasons]), gte(stockMovements.createdAt, since)))
        .groupBy(stockMovements.lotId)
        .as('used');
      return db
        .select({
          code: lots.code,
          name: lots.name,
          isListed: lots.isListed,
          stockGrams: lots.stockGrams,
          reorderPointGrams: lots.reorderPointGrams,
          supplierLeadTimeDays: lots.supplierLeadTimeDays,
          usedGrams: sql<number>`coalesce(${used.usedGrams}, 0)`.mapWith(Number),
        })
        .from(lots)
        .leftJoin(used, eq(used.lotId, lots.id))
        .orderBy(asc(lots.code));
    },
  };
}

export type LotsAdminRepo = ReturnType<typeof createLotsAdminRepo>;
