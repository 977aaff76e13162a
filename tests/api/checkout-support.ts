// Readers for the checkout and orders tests: a lot's stock and its stock movements.
import { and, eq, sql } from 'drizzle-orm';
import { lots, stockMovements } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';

export async function stockOf(lotId: string) {
  const [row] = await getTestDb().select({ stockGrams: lots.stockGrams }).from(lots).where(eq(lots.id, lotId));
  return row!.stockGrams;
}

/** The sum of a lot's movements (optionally for one order) and how many there are. */
export async function movementsOf(lotId: string, orderId?: string) {
  const [row] = await getTestDb()
    .select({ sum: sql<number>`coalesce(sum(${stockMovements.deltaGrams}), 0)::int`, count: sql<number>`count(*)::int` })
    .from(stockMovements)
    .where(and(eq(stockMovements.lotId, lotId), orderId ? eq(stockMovements.orderId, orderId) : undefined));
  return row!;
}
