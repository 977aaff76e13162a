// Helpers for the Roasted to Order staff-side tests (preview, Subscribers, Roaster's Rotation,
// renewal reminders): invented subscriptions, deliveries and orders written straight to the test
// database, and the shop's settings pinned for a test file and put back after it.
import { eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll } from 'vitest';
import { bagFillGrams } from '@shared/domain/units';
import type { BrewMethod, DeliveryStatus, Grind, OrderStatus, RoastedBagSize, RoastLevel, SubscriptionStatus } from '@shared/domain/vocabulary';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import { deliveries, orderItems, orders, roastDays, shopSettings, subscriptions } from '../../server/db/schema/index';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';
import type { TestUser } from '../setup/test-users';
import { shipTo } from './checkout-support';

/** Saves `settings` before the file's tests and restores the shop's row (or its absence) after them. */
export function useShopSettings(settings: ShopSettings = defaultShopSettings) {
  let saved: (typeof shopSettings.$inferSelect)[] = [];
  beforeAll(async () => {
    saved = await getTestDb().select().from(shopSettings);
    await saveShopSettings(getTestDb(), settings, 'Invented Test Roastery');
  });
  afterAll(async () => {
    await getTestDb().delete(shopSettings);
    if (saved.length > 0) await getTestDb().insert(shopSettings).values(saved);
  });
}

/** Roast Calendar overrides for a test, removed after the file. */
export function useCalendarOverrides() {
  const dates: string[] = [];
  afterAll(async () => {
    if (dates.length > 0) await getTestDb().delete(roastDays).where(inArray(roastDays.date, dates));
  });
  return async (date: string, override: { open: boolean; capacityGrams?: number | null; note?: string }) => {
    dates.push(date);
    await getTestDb()
      .insert(roastDays)
      .values({ date, open: override.open, capacityGrams: override.capacityGrams ?? null, note: override.note ?? '' })
      .onConflictDoUpdate({ target: roastDays.date, set: { open: override.open, capacityGrams: override.capacityGrams ?? null } });
  };
}

export interface InventedSubscription {
  lotId?: string | null;
  status?: SubscriptionStatus;
  roastLevel?: RoastLevel;
  bagSize?: RoastedBagSize;
  bagsPerDelivery?: number;
  grind?: Grind;
  brewMethod?: BrewMethod;
  cadenceWeeks?: number;
  priceCents?: number;
  pausedUntil?: string | null;
  anchorDate?: string | null;
  currentPeriodEnd?: Date | null;
  cancelledAt?: Date | null;
  createdAt?: Date;
}

/** A subscription as the subscriptions flow would leave it (Roaster's Rotation unless a lot is given). */
export async function inventSubscription(owner: TestUser, fields: InventedSubscription = {}) {
  const [row] = await getTestDb()
    .insert(subscriptions)
    .values({
      userId: owner.id,
      status: fields.status ?? 'active',
      lotId: fields.lotId ?? null,
      roastLevel: fields.roastLevel ?? 'medium',
      bagSize: fields.bagSize ?? '12oz',
      bagsPerDelivery: fields.bagsPerDelivery ?? 1,
      grind: fields.grind ?? 'whole-bean',
      brewMethod: fields.brewMethod ?? 'filter',
      cadenceWeeks: fields.cadenceWeeks ?? 2,
      priceCents: fields.priceCents ?? 2315,
      pausedUntil: fields.pausedUntil ?? null,
      anchorDate: fields.anchorDate ?? null,
      currentPeriodEnd: fields.currentPeriodEnd ?? null,
      cancelledAt: fields.cancelledAt ?? null,
      shippingAddress: { ...shipTo, line2: null, country: 'US' },
      ...(fields.createdAt ? { createdAt: fields.createdAt } : {}),
    })
    .returning({ id: subscriptions.id });
  return row!.id;
}

/** One materialized delivery; the dates after the roast date are the default shop's (filter, ship next day). */
export async function inventDelivery(subscriptionId: string, sequence: number, roastDate: string, status: DeliveryStatus = 'scheduled') {
  const day = new Date(`${roastDate}T12:00:00Z`).getTime();
  const plus = (days: number) => new Date(day + days * 86_400_000).toISOString().slice(0, 10);
  const [row] = await getTestDb()
    .insert(deliveries)
    .values({ subscriptionId, sequence, roastDate, shipDate: plus(1), readyFrom: plus(2), bestBefore: plus(28), status })
    .returning({ id: deliveries.id });
  return row!.id;
}

/** The order a paid delivery became, with one roasted line of the subscription's bags. */
export async function inventDeliveryOrder(
  owner: TestUser,
  subscriptionId: string,
  deliveryId: string,
  line: { roastDate: string; size: RoastedBagSize; quantity: number; roastLevel?: RoastLevel; lotId?: string | null; status?: OrderStatus },
) {
  const unit = 1620;
  const [order] = await getTestDb()
    .insert(orders)
    .values({
      userId: owner.id,
      kind: 'roasted',
      status: line.status ?? 'paid',
      subscriptionId,
      deliveryId,
      subtotalCents: unit * line.quantity,
      shippingCents: 895,
      totalCents: unit * line.quantity + 895,
      shippingAddress: { ...shipTo, line2: null, country: 'US' },
      roastDate: line.roastDate,
      paidAt: new Date(),
    })
    .returning({ id: orders.id });
  await getTestDb()
    .insert(orderItems)
    .values({
      orderId: order!.id,
      lotId: line.lotId ?? null,
      kind: 'roasted',
      size: line.size,
      quantity: line.quantity,
      fillGrams: bagFillGrams(line.size),
      roastLevel: line.roastLevel ?? 'medium',
      grind: 'whole-bean',
      brewMethod: 'filter',
      unitPriceCents: unit,
      lineTotalCents: unit * line.quantity,
    });
  await getTestDb().update(deliveries).set({ orderId: order!.id }).where(eq(deliveries.id, deliveryId));
  return order!.id;
}
