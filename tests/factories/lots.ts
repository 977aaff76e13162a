// Invented green lots, written straight to the test database.
import { randomUUID } from 'node:crypto';
import { lots, stockMovements } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';

export type LotFields = Partial<typeof lots.$inferInsert> & {
  /** Also record the stock as an arrival, so the lot's movements add up to its stock. */
  withArrival?: boolean;
};

/** An invented listed lot (by default: no stock, $40.00/kg, no quantity breaks, a unique code). */
export async function createLot({ withArrival = false, ...fields }: LotFields = {}) {
  const code = fields.code ?? `LOT-${randomUUID().slice(0, 8).toUpperCase()}`;
  const db = getTestDb();
  const [lot] = await db
    .insert(lots)
    .values({
      name: `Invented lot ${code}`,
      origin: 'Testland',
      region: 'High Meadow',
      producer: 'Invented Growers Cooperative',
      variety: 'Bourbon',
      process: 'washed',
      altitudeM: 1800,
      cropYear: 2026,
      moisturePct: 10.5,
      suggestedLevel: 'medium',
      allowedLevels: ['light', 'medium'],
      stockGrams: 0,
      pricePerKgCents: 4000,
      ...fields,
      code,
    })
    .returning({ id: lots.id, code: lots.code, name: lots.name, stockGrams: lots.stockGrams });
  if (withArrival && lot!.stockGrams > 0) await db.insert(stockMovements).values({ lotId: lot!.id, deltaGrams: lot!.stockGrams, reason: 'arrival' });
  return lot!;
}

/** A lot for the checkout, order and payment tests: `stockGrams` on hand at $40.00/kg. */
export async function createLotForSale(stockGrams: number) {
  return createLot({ stockGrams });
}

/** A lot for the Roastery tests, every roast level allowed, its stock recorded as an arrival. */
export async function createStockedLot(code: string, options: { name?: string; stockGrams?: number } = {}): Promise<string> {
  const lot = await createLot({
    code,
    ...(options.name ? { name: options.name } : {}),
    stockGrams: options.stockGrams ?? 0,
    pricePerKgCents: 2400,
    allowedLevels: ['light', 'medium', 'medium-dark', 'dark'],
    withArrival: true,
  });
  return lot.id;
}
