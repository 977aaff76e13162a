import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { HomeRoastDevice, RoastLevel } from '@shared/domain/vocabulary';
import type { Db } from '../../db/client';
import { journalEntries, lots, orderItems, orders } from '../../db/schema/index';
import { loadShopSettings } from '../settings';

export interface JournalLot {
  id: string;
  code: string;
  name: string;
  suggestedLevel: RoastLevel;
}

export interface StoredEntry {
  lotId: string;
  device: HomeRoastDevice;
  roastedOn: string;
  greenGrams: number;
  roastedGrams: number;
  yellowSeconds: number | null;
  firstCrackSeconds: number | null;
  endSeconds: number;
  levelReached: RoastLevel | null;
  estimatedLevel: RoastLevel;
  lossPct: number;
  developmentSeconds: number | null;
  notes: string;
}

// Orders whose coffee reached the customer's hands (or is on its way).
const boughtStatuses = ['paid', 'held', 'roasted', 'packed', 'shipped'] as const;

const entryColumns = {
  id: journalEntries.id,
  lotCode: lots.code,
  lotName: lots.name,
  suggestedLevel: lots.suggestedLevel,
  device: journalEntries.device,
  roastedOn: journalEntries.roastedOn,
  greenGrams: journalEntries.greenGrams,
  roastedGrams: journalEntries.roastedGrams,
  yellowSeconds: journalEntries.yellowSeconds,
  firstCrackSeconds: journalEntries.firstCrackSeconds,
  endSeconds: journalEntries.endSeconds,
  levelReached: journalEntries.levelReached,
  estimatedLevel: journalEntries.estimatedLevel,
  lossPct: journalEntries.lossPct,
  developmentSeconds: journalEntries.developmentSeconds,
  notes: journalEntries.notes,
  createdAt: journalEntries.createdAt,
};

export function createJournalRepo(db: Db) {
  return {
    shopSettings: () => loadShopSettings(db),

    async lotByCode(code: string): Promise<JournalLot | undefined> {
      const [row] = await db
        .select({ id: lots.id, code: lots.code, name: lots.name, suggestedLevel: lots.suggestedLevel })
        .from(lots)
        .where(eq(lots.code, code));
      return row;
    },

    /** Listed lots, and any lot the customer bought (even one no longer listed), with which is which. */
    async lotsFor(userId: string): Promise<{ code: string; name: string; bought: boolean }[]> {
      const bought = db
        .selectDistinct({ lotId: orderItems.lotId })
        .from(orderItems)
        .innerJoin(orders, eq(orders.id, orderItems.orderId))
        .where(and(eq(orders.userId, userId), inArray(orders.status, [...boughtStatuses])));
      const boughtIds = new Set((await bought).map((row) => row.lotId));
      const rows = await db.select({ id: lots.id, code: lots.code, name: lots.name, isListed: lots.isListed }).from(lots).orderBy(asc(lots.name));
      return rows
        .filter((row) => row.isListed || boughtIds.has(row.id))
        .map((row) => ({ code: row.code, name: row.name, bought: boughtIds.has(row.id) }))
        .sort((a, b) => Number(b.bought) - Number(a.bought));
    },

    /** The customer's own entries, newest roast first. */
    list(userId: string, filter: { lotId?: string | undefined; device?: HomeRoastDevice | undefined }) {
      return db
        .select(entryColumns)
        .from(journalEntries)
        .innerJoin(lots, eq(lots.id, journalEntries.lotId))
        .where(
          and(
            eq(journalEntries.userId, userId),
            filter.lotId ? eq(journalEntries.lotId, filter.lotId) : undefined,
            filter.device ? eq(journalEntries.device, filter.device) : undefined,
          ),
        )
        .orderBy(desc(journalEntries.roastedOn), desc(journalEntries.createdAt));
    },

    async insert(userId: string, entry: StoredEntry): Promise<string> {
      const [row] = await db
        .insert(journalEntries)
        .values({ userId, ...entry })
        .returning({ id: journalEntries.id });
      return row!.id;
    },

    /** False when no entry of this customer has the id (another customer's entry is not theirs to change). */
    async update(userId: string, id: string, entry: StoredEntry): Promise<boolean> {
      const rows = await db
        .update(journalEntries)
        .set(entry)
        .where(and(eq(journalEntries.id, id), eq(journalEntries.userId, userId)))
        .returning({ id: journalEntries.id });
      return rows.length > 0;
    },

    async remove(userId: string, id: string): Promise<boolean> {
      const rows = await db
        .delete(journalEntries)
        .where(and(eq(journalEntries.id, id), eq(journalEntries.userId, userId)))
        .returning({ id: journalEntries.id });
      return rows.length > 0;
    },

    /** Every roast of a lot, with only what an anonymous summary needs. */
    roastsOfLot(lotId: string) {
      return db
        .select({
          customerId: journalEntries.userId,
          lossPct: journalEntries.lossPct,
          developmentSeconds: journalEntries.developmentSeconds,
          levelReached: journalEntries.levelReached,
          estimatedLevel: journalEntries.estimatedLevel,
        })
        .from(journalEntries)
        .where(eq(journalEntries.lotId, lotId));
    },
  };
}

export type JournalRepo = ReturnType<typeof createJournalRepo>;
