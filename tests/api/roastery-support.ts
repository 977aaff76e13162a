// Invented lots, orders and deliveries for the Roastery API tests, written straight to the test database.
import { randomUUID } from 'node:crypto';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import type { BrewMethod, Grind, RoastedBagSize, RoastLevel } from '@shared/domain/vocabulary';
import { bagFillGrams } from '@shared/domain/units';
import { deliveries, lots, orderItems, orders, rotationPicks, stockMovements, subscriptions } from '../../server/db/schema/index';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';

const address = { name: 'Invented Customer', line1: '7 Invented Lane', city: 'Larch Bend', region: 'MT', postalCode: '59701', country: 'US' };

/** A run-unique prefix, so lot codes never collide with another file's rows. */
export const runTag = () => randomUUID().slice(0, 6).toUpperCase();

export async function insertLot(code: string, options: { name?: string; stockGrams?: number } = {}): Promise<string> {
  const stockGrams = options.stockGrams ?? 0;
  const db = getTestDb();
  const [row] = await db
    .insert(lots)
    .values({
      code,
      name: options.name ?? `Invented lot ${code}`,
      origin: 'Testland',
      region: 'High Meadow',
      producer: 'Invented Growers Cooperative',
      variety: 'Bourbon',
      process: 'washed',
      altitudeM: 1800,
      cropYear: 2026,
      moisturePct: 10.5,
      suggestedLevel: 'medium',
      allowedLevels: ['light', 'medium', 'medium-dark', 'dark'],
      stockGrams,
      pricePerKgCents: 2400,
    })
    .returning({ id: lots.id });
  // The movements always add up to the stock: a lot's first stock is an arrival.
  if (stockGrams > 0) await db.insert(stockMovements).values({ lotId: row!.id, deltaGrams: stockGrams, reason: 'arrival' });
  return row!.id;
}

export interface RoastedLine {
  lotId: string | null;
  size: RoastedBagSize;
  quantity: number;
  roastLevel: RoastLevel;
  brewMethod?: BrewMethod;
  grind?: Grind;
}

export async function insertRoastedOrder(options: {
  userId: string;
  roastDate: string;
  status?: 'pending_payment' | 'paid' | 'held' | 'roasted' | 'cancelled';
  lines: RoastedLine[];
  paidAt?: Date;
  deliveryId?: string;
  subscriptionId?: string;
  dates?: { shipDate: string; readyFrom: string; bestBefore: string };
}): Promise<string> {
  const db = getTestDb();
  const unitPriceCents = 1800;
  const subtotalCents = options.lines.reduce((total, line) => total + unitPriceCents * line.quantity, 0);
  const [order] = await db
    .insert(orders)
    .values({
      userId: options.userId,
      kind: 'roasted',
      status: options.status ?? 'paid',
      subtotalCents,
      shippingCents: 0,
      totalCents: subtotalCents,
      shippingAddress: address,
      roastDate: options.roastDate,
      ...(options.dates ?? {}),
      paidAt: options.paidAt ?? new Date('2026-11-20T15:00:00Z'),
      deliveryId: options.deliveryId ?? null,
      subscriptionId: options.subscriptionId ?? null,
    })
    .returning({ id: orders.id });
  await db.insert(orderItems).values(
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
      unitPriceCents,
      lineTotalCents: unitPriceCents * line.quantity,
    })),
  );
  return order!.id;
}

export async function insertSubscriptionDelivery(options: {
  userId: string;
  lotId: string | null;
  roastLevel: RoastLevel;
  brewMethod: BrewMethod;
  roastDate: string;
  dates: { shipDate: string; readyFrom: string; bestBefore: string };
}): Promise<{ subscriptionId: string; deliveryId: string }> {
  const db = getTestDb();
  const [subscription] = await db
    .insert(subscriptions)
    .values({
      userId: options.userId,
      status: 'active',
      lotId: options.lotId,
      roastLevel: options.roastLevel,
      bagSize: '12oz',
      brewMethod: options.brewMethod,
      cadenceWeeks: 2,
      shippingAddress: address,
      priceCents: 1620,
    })
    .returning({ id: subscriptions.id });
  const [delivery] = await db
    .insert(deliveries)
    .values({ subscriptionId: subscription!.id, sequence: 1, roastDate: options.roastDate, ...options.dates })
    .returning({ id: deliveries.id });
  return { subscriptionId: subscription!.id, deliveryId: delivery!.id };
}

export async function pickRotationLot(roastDate: string, lotId: string) {
  await getTestDb().insert(rotationPicks).values({ roastDate, lotId }).onConflictDoUpdate({ target: rotationPicks.roastDate, set: { lotId } });
}

/** The product defaults with the test's own changes, saved as the shop's settings. */
export async function useShopSettings(changes: Partial<ShopSettings> = {}): Promise<ShopSettings> {
  const settings = { ...defaultShopSettings, ...changes };
  await saveShopSettings(getTestDb(), settings, 'Invented Test Roastery');
  return settings;
}
