// Invented orders and their lines, written straight to the test database as checkout, the payment
// webhook or a subscription delivery leaves them.
import { bagFillGrams } from '@shared/domain/units';
import type { BagSize, BrewMethod, Grind, OrderStatus, RoastLevel } from '@shared/domain/vocabulary';
import { orderItems, orders } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';
import { shippingAddress } from './addresses';
import { dayAfter } from './unique';

export interface OrderLine {
  /** Null: a Roaster's Rotation line. */
  lotId: string | null;
  size: BagSize;
  quantity: number;
  unitPriceCents: number;
  /** Roasted lines only; grind and brew method default to whole bean for filter. */
  roastLevel?: RoastLevel;
  grind?: Grind;
  brewMethod?: BrewMethod;
}

export type OrderFields = Omit<Partial<typeof orders.$inferInsert>, 'userId'> & {
  userId: string;
  lines?: OrderLine[];
};

/**
 * One order with its lines. Kind, subtotal and total follow the lines (green unless a line has a
 * roast level; total = subtotal + shipping) unless `fields` say otherwise; the address is the tests' own.
 */
export async function createOrder({ lines = [], ...fields }: OrderFields) {
  const db = getTestDb();
  const roasted = lines.some((line) => line.roastLevel);
  const subtotalCents = fields.subtotalCents ?? lines.reduce((sum, line) => sum + line.unitPriceCents * line.quantity, 0);
  const shippingCents = fields.shippingCents ?? 0;
  const [order] = await db
    .insert(orders)
    .values({
      kind: roasted ? 'roasted' : 'green',
      shippingAddress,
      ...fields,
      subtotalCents,
      shippingCents,
      totalCents: fields.totalCents ?? subtotalCents + shippingCents,
    })
    .returning();
  if (lines.length > 0) {
    await db.insert(orderItems).values(
      lines.map((line) => ({
        orderId: order!.id,
        lotId: line.lotId,
        kind: line.roastLevel ? ('roasted' as const) : ('green' as const),
        size: line.size,
        quantity: line.quantity,
        fillGrams: bagFillGrams(line.size),
        ...(line.roastLevel ? { roastLevel: line.roastLevel, grind: line.grind ?? 'whole-bean', brewMethod: line.brewMethod ?? 'filter' } : {}),
        unitPriceCents: line.unitPriceCents,
        lineTotalCents: line.unitPriceCents * line.quantity,
      })),
    );
  }
  return order!;
}

/** A green order of one lot: 1 × 1 lb at $18.99 and 2 × 8 oz at $10.50, plus $8.50 shipping = $48.49 (awaiting payment unless `status` says otherwise). */
export async function createGreenOrder(userId: string, lotId: string, fields: { status?: OrderStatus; shipDate?: string } = {}) {
  return createOrder({
    userId,
    ...fields,
    shippingCents: 850,
    lines: [
      { lotId, size: '1lb', quantity: 1, unitPriceCents: 1899 },
      { lotId, size: '8oz', quantity: 2, unitPriceCents: 1050 },
    ],
  });
}

export type RoastedLine = Omit<OrderLine, 'unitPriceCents' | 'roastLevel'> & { roastLevel: RoastLevel };

/** A roasted order roasting on `roastDate` (roasted by default), shipping the next day unless `shipDate` says otherwise; $15.00 a bag. */
export async function createRoastedOrder(userId: string, options: { roastDate: string; status?: OrderStatus; lines: RoastedLine[]; shipDate?: string }) {
  return createOrder({
    userId,
    kind: 'roasted',
    status: options.status ?? 'roasted',
    roastDate: options.roastDate,
    shipDate: options.shipDate ?? dayAfter(options.roastDate, 1),
    readyFrom: dayAfter(options.roastDate, 4),
    bestBefore: dayAfter(options.roastDate, 28),
    lines: options.lines.map((line) => ({ ...line, unitPriceCents: 1500 })),
  });
}

/** A paid roasted order on `roastDate` for the Roastery tests; $18.00 a bag. */
export async function createPaidRoastedOrder(options: {
  userId: string;
  roastDate: string;
  status?: 'pending_payment' | 'paid' | 'held' | 'roasted' | 'cancelled';
  lines: RoastedLine[];
  paidAt?: Date;
  deliveryId?: string;
  subscriptionId?: string;
  dates?: { shipDate: string; readyFrom: string; bestBefore: string };
}): Promise<string> {
  const order = await createOrder({
    userId: options.userId,
    kind: 'roasted',
    status: options.status ?? 'paid',
    roastDate: options.roastDate,
    ...(options.dates ?? {}),
    paidAt: options.paidAt ?? new Date('2026-11-20T15:00:00Z'),
    deliveryId: options.deliveryId ?? null,
    subscriptionId: options.subscriptionId ?? null,
    lines: options.lines.map((line) => ({ ...line, unitPriceCents: 1800 })),
  });
  return order.id;
}
