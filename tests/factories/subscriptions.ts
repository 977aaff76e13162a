// Invented subscriptions, their deliveries and the orders paid deliveries became, written straight
// to the test database as the subscriptions flow leaves them.
import { eq } from 'drizzle-orm';
import type { BrewMethod, DeliveryStatus, OrderStatus, RoastedBagSize, RoastLevel } from '@shared/domain/vocabulary';
import { deliveries, subscriptions } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';
import { shippingAddress, shipTo } from './addresses';
import { createLotForSale } from './lots';
import { createOrder } from './orders';
import type { TestUser } from './users';

export type SubscriptionFields = Omit<Partial<typeof subscriptions.$inferInsert>, 'userId'> & { userId: string };

/** One subscription: 1 × 12 oz of medium every two weeks at $23.15 unless `fields` say otherwise (status: the column's default, incomplete). */
export async function createSubscription(fields: SubscriptionFields) {
  const [row] = await getTestDb()
    .insert(subscriptions)
    .values({ roastLevel: 'medium', bagSize: '12oz', cadenceWeeks: 2, priceCents: 2315, shippingAddress, ...fields })
    .returning();
  return row!;
}

/** An active subscription (2 × 12 oz, medium, whole bean, filter, weekly, $41.35) on a lot of its own, whose grid starts on Monday 6 January 2031. */
export async function createWeeklySubscription(owner: TestUser, overrides: InventedSubscription = {}) {
  const lot = await createLotForSale(20_000);
  const row = await createSubscription({
    userId: owner.id,
    status: 'active',
    lotId: lot.id,
    bagsPerDelivery: 2,
    cadenceWeeks: 1,
    priceCents: 4135,
    anchorDate: '2031-01-06',
    shippingAddress: { ...shipTo, country: 'US' },
    ...overrides,
  });
  return { id: row.id, lot };
}

export type InventedSubscription = Omit<Partial<typeof subscriptions.$inferInsert>, 'userId' | 'id'>;

/** An active subscription as the subscriptions flow would leave it (Roaster's Rotation unless a lot is given). */
export async function inventSubscription(owner: TestUser, fields: InventedSubscription = {}) {
  return (await createSubscription({ userId: owner.id, status: 'active', ...fields })).id;
}

export type DeliveryFields = Omit<Partial<typeof deliveries.$inferInsert>, 'subscriptionId' | 'roastDate'> & { subscriptionId: string; roastDate: string };

/** One materialized delivery; unless given, the dates after the roast date are the default shop's (filter, ship next day). */
export async function createDelivery(fields: DeliveryFields) {
  const day = new Date(`${fields.roastDate}T12:00:00Z`).getTime();
  const plus = (days: number) => new Date(day + days * 86_400_000).toISOString().slice(0, 10);
  const [row] = await getTestDb()
    .insert(deliveries)
    .values({ sequence: 1, shipDate: plus(1), readyFrom: plus(2), bestBefore: plus(28), ...fields })
    .returning();
  return row!;
}

export async function inventDelivery(subscriptionId: string, sequence: number, roastDate: string, status: DeliveryStatus = 'scheduled') {
  return (await createDelivery({ subscriptionId, sequence, roastDate, status })).id;
}

/** The order a paid delivery became, with one roasted line of the subscription's bags ($16.20 a bag, $8.95 shipping). */
export async function inventDeliveryOrder(
  owner: TestUser,
  subscriptionId: string,
  deliveryId: string,
  line: { roastDate: string; size: RoastedBagSize; quantity: number; roastLevel?: RoastLevel; lotId?: string | null; status?: OrderStatus },
) {
  const order = await createOrder({
    userId: owner.id,
    kind: 'roasted',
    status: line.status ?? 'paid',
    subscriptionId,
    deliveryId,
    shippingCents: 895,
    roastDate: line.roastDate,
    paidAt: new Date(),
    lines: [{ lotId: line.lotId ?? null, size: line.size, quantity: line.quantity, roastLevel: line.roastLevel ?? 'medium', unitPriceCents: 1620 }],
  });
  await getTestDb().update(deliveries).set({ orderId: order.id }).where(eq(deliveries.id, deliveryId));
  return order.id;
}

/** An active 12 oz subscription ($16.20) with its first delivery on `roastDate`, for the Roastery tests. */
export async function createSubscriptionDelivery(options: {
  userId: string;
  lotId: string | null;
  roastLevel: RoastLevel;
  brewMethod: BrewMethod;
  roastDate: string;
  dates: { shipDate: string; readyFrom: string; bestBefore: string };
}): Promise<{ subscriptionId: string; deliveryId: string }> {
  const { userId, lotId, roastLevel, brewMethod, roastDate, dates } = options;
  const subscription = await createSubscription({
    userId,
    status: 'active',
    lotId,
    roastLevel,
    bagSize: '12oz',
    brewMethod,
    cadenceWeeks: 2,
    priceCents: 1620,
  });
  const delivery = await createDelivery({ subscriptionId: subscription.id, sequence: 1, roastDate, ...dates });
  return { subscriptionId: subscription.id, deliveryId: delivery.id };
}

/** A subscription not started yet (2 × 12 oz, $36.00 every two weeks); its deliveries come with its first payment. */
export async function createPendingSubscription(userId: string, lotId: string | null) {
  const subscription = await createSubscription({ userId, lotId, bagsPerDelivery: 2, priceCents: 3600 });
  return { id: subscription.id };
}

/** A `POST /api/checkout/subscription` body: the Roaster's Rotation, one 12 oz bag, medium, whole bean for filter, every 2 weeks, to the tests' address. */
export const rotationCheckoutRequest = {
  lotCode: null,
  roastLevel: 'medium',
  bagSize: '12oz',
  bagsPerDelivery: 1,
  grind: 'whole-bean',
  brewMethod: 'filter',
  cadenceWeeks: 2,
  shippingAddress: shipTo,
} as const;
