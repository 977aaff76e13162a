// Helpers for the checkout and orders tests: invented lots written straight to the test database,
// and readers for their stock and stock movements.
import { randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { lots, stockMovements } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';

/** An invented listed lot at $40.00/kg with no quantity breaks. */
export async function createLotForSale(stockGrams: number) {
  const code = `CHK-${randomUUID().slice(0, 8).toUpperCase()}`;
  const [lot] = await getTestDb()
    .insert(lots)
    .values({
      code,
      name: `Invented Hollow ${code}`,
      origin: 'Testland',
      region: 'Lower Vale',
      producer: 'Invented Valley Growers',
      variety: 'Typica',
      process: 'washed',
      altitudeM: 1650,
      cropYear: 2026,
      moisturePct: 10.9,
      suggestedLevel: 'medium',
      allowedLevels: ['light', 'medium'],
      stockGrams,
      pricePerKgCents: 4000,
    })
    .returning({ id: lots.id, code: lots.code, name: lots.name });
  return lot!;
}

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

export const shipTo = { name: 'Robin Invented', line1: '4 Larkspur Lane', city: 'Wrenfield', region: 'CO', postalCode: '81640' };
