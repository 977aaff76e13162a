// Helpers for the Pack List, shipping, refund, trace and rest-day tests: invented orders and batches
// written straight to the test database, as checkout, subscriptions and the batch form leave them.
import { randomInt } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import { bagFillGrams } from '@shared/domain/units';
import type { BagSize, BrewMethod, Grind, OrderStatus, RoastLevel } from '@shared/domain/vocabulary';
import { bagAllocations, batches, orderItems, orders, rotationPicks } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';
import { shipTo } from './checkout-support';

/**
 * A ship day no other test uses: a random day in 2040–2089, so each test reads only its own
 * orders from the shared database (and the real clock's scheduled jobs never reach them).
 */
export function uniqueDay(): string {
  const day = new Date(Date.UTC(2040, 0, 1) + randomInt(0, 50 * 365) * 86_400_000);
  return day.toISOString().slice(0, 10);
}

export function dayAfter(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

export interface RoastedLine {
  /** Null: Roaster's Rotation. */
  lotId: string | null;
  size: BagSize;
  quantity: number;
  roastLevel: RoastLevel;
  grind?: Grind;
  brewMethod?: BrewMethod;
}

/** A roasted (subscription) order roasting on `roastDate`, shipping the next day unless `shipDate` says otherwise; $15.00 a bag. */
export async function createRoastedOrder(userId: string, options: { roastDate: string; status?: OrderStatus; lines: RoastedLine[]; shipDate?: string }) {
  const shipDate = options.shipDate ?? dayAfter(options.roastDate, 1);
  const bagCount = options.lines.reduce((sum, line) => sum + line.quantity, 0);
  const [order] = await getTestDb()
    .insert(orders)
    .values({
      userId,
      kind: 'roasted',
      status: options.status ?? 'roasted',
      subtotalCents: bagCount * 1500,
      shippingCents: 0,
      totalCents: bagCount * 1500,
      shippingAddress: { ...shipTo, line2: null, country: 'US' },
      roastDate: options.roastDate,
      shipDate,
      readyFrom: dayAfter(options.roastDate, 4),
      bestBefore: dayAfter(options.roastDate, 28),
    })
    .returning({ id: orders.id, shipDate: orders.shipDate, readyFrom: orders.readyFrom, bestBefore: orders.bestBefore });
  await getTestDb()
    .insert(orderItems)
    .values(
      options.lines.map((line) => ({
        orderId: order!.id,
        lotId: line.lotId,
        kind: 'roasted' as const,
        size: line.size,
        quantity: line.quantity,
        fillGrams: bagFillGrams(line.size),
        roastLevel: line.roastLevel,
        grind: line.grind ?? 'whole-bean',
        brewMethod: line.brewMethod ?? 'filter',
        unitPriceCents: 1500,
        lineTotalCents: 1500 * line.quantity,
      })),
    );
  return order!;
}

/** A paid green order shipping on `shipDate`: 1 × 1 lb and 2 × 8 oz of one lot. */
export async function createGreenOrderShipping(userId: string, lotId: string, shipDate: string, status: OrderStatus = 'paid') {
  const [order] = await getTestDb()
    .insert(orders)
    .values({ userId, kind: 'green', status, subtotalCents: 3999, shippingCents: 850, totalCents: 4849, shippingAddress: { ...shipTo, line2: null, country: 'US' }, shipDate })
    .returning({ id: orders.id });
  await getTestDb()
    .insert(orderItems)
    .values([
      { orderId: order!.id, lotId, kind: 'green', size: '1lb', quantity: 1, fillGrams: 454, unitPriceCents: 1899, lineTotalCents: 1899 },
      { orderId: order!.id, lotId, kind: 'green', size: '8oz', quantity: 2, fillGrams: 227, unitPriceCents: 1050, lineTotalCents: 2100 },
    ]);
  return order!;
}

/** A recorded batch with `roastedGramsOut` roasted grams (15% loss from the green weight). */
export async function recordBatch(options: { lotId: string; roastDate: string; roastLevel: RoastLevel; roastedGramsOut: number }) {
  const greenGramsIn = Math.ceil(options.roastedGramsOut / 0.85);
  const [batch] = await getTestDb()
    .insert(batches)
    .values({
      lotId: options.lotId,
      roastDate: options.roastDate,
      roastLevel: options.roastLevel,
      greenGramsIn,
      roastedGramsOut: options.roastedGramsOut,
      lossPct: Math.round(((greenGramsIn - options.roastedGramsOut) / greenGramsIn) * 10_000) / 100,
      withinExpected: true,
    })
    .returning({ id: batches.id });
  return batch!;
}

export async function pickRotationLot(roastDate: string, lotId: string) {
  await getTestDb().insert(rotationPicks).values({ roastDate, lotId });
}

export async function allocationsOf(orderId: string) {
  return getTestDb()
    .select({ batchId: bagAllocations.batchId, orderItemId: bagAllocations.orderItemId, bags: bagAllocations.bags, grams: bagAllocations.grams })
    .from(bagAllocations)
    .innerJoin(batches, eq(batches.id, bagAllocations.batchId))
    .where(eq(bagAllocations.orderId, orderId))
    .orderBy(asc(batches.createdAt), asc(batches.id));
}

export async function orderStatusOf(orderId: string) {
  const [row] = await getTestDb().select().from(orders).where(eq(orders.id, orderId));
  return row!;
}
