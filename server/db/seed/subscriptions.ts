// Subscriptions (invented subscribers), their deliveries, and the order each billed delivery made.
import type { EmailPayloads } from '../../../emails/index';
import { demoTrackingUrl } from './shop';
import {
  roastersRotationName,
  type BrewMethod,
  type Grind,
  type OrderStatus,
  type RoastedBagSize,
  type RoastLevel,
  type SubscriptionStatus,
} from '../../../shared/domain/vocabulary';
import type * as schema from '../schema/index';
import type { AddressSnapshot } from '../schema/index';
import type { DeliveryDates } from './demo-dates';
import type { DemoLot } from './demo-lots';
import type { ScenarioContext } from './scenario-context';
import { CURRENCY, earlier, FILL_GRAMS, HOUR_MS, SUBSCRIPTION_BAG_PRICE_CENTS, type Insert } from './scenario-values';

/** A roasted line of a past roast day, for the batches and "roasted" e-mails (lotId resolved for Roaster's Rotation). */
export type RoastedLine = {
  roastDate: string;
  lotId: string;
  level: RoastLevel;
  item: Insert<typeof schema.orderItems>;
  userId: string;
  roastedEmail: EmailPayloads['roasted'];
};

type SubscriptionRows = {
  subscriptions: Insert<typeof schema.subscriptions>[];
  deliveries: Insert<typeof schema.deliveries>[];
  orders: Insert<typeof schema.orders>[];
  orderItems: Insert<typeof schema.orderItems>[];
  roastedLines: RoastedLine[];
};

/** What one subscription orders on each delivery. */
type SubscriptionOrderPlan = {
  subscriptionId: string;
  userId: string;
  name: string;
  code: string | null;
  coffee: string;
  roastLevel: RoastLevel;
  brewMethod: BrewMethod;
  grind: Grind;
  bagSize: RoastedBagSize;
  bagsPerDelivery: number;
  priceCents: number;
  address: AddressSnapshot;
};

// Mostly active; a few paused, one past due, one cancelled, one whose checkout never finished.
const statusPlan: Record<number, SubscriptionStatus> = { 5: 'paused', 17: 'paused', 26: 'paused', 11: 'past_due', 23: 'cancelled', 31: 'incomplete' };
const rotationPlan = new Set([3, 9, 14, 20, 29]);
const subscriptionLots = [
  'WR-24-ETH-01',
  'WR-24-ETH-02',
  'WR-24-COL-01',
  'WR-24-COL-01',
  'WR-24-GTM-01',
  'WR-24-GTM-01',
  'WR-24-BRA-01',
  'WR-24-BRA-01',
  'WR-24-BRA-01',
  'WR-24-SUM-01',
  'WR-25-PER-01',
  'WR-25-RWA-01',
];
const SUBSCRIPTIONS = 36;

export function demoSubscriptions(ctx: ScenarioContext, pickedLotOn: (roastDate: string) => string): SubscriptionRows {
  const { rng, clock, settings, cal, accounts, catalogue, outbox } = ctx;
  const { today } = cal;
  const rows: SubscriptionRows = { subscriptions: [], deliveries: [], orders: [], orderItems: [], roastedLines: [] };
  const stripeCustomer = new Map<string, string>();
  const stripeCustomerOf = (userId: string) => {
    if (!stripeCustomer.has(userId)) stripeCustomer.set(userId, `cus_demo_${rng.hex(7)}`);
    return stripeCustomer.get(userId) as string;
  };
  const { customerIds } = accounts;

  for (let i = 0; i < SUBSCRIPTIONS; i += 1) {
    const status = statusPlan[i] ?? 'active';
    const userId = i === 0 || i === 3 ? accounts.demoCustomerId : (customerIds[1 + (i % (customerIds.length - 1))] as string);
    const rotation = rotationPlan.has(i);
    // One subscriber on the low-stock lot, so a roast list shows a shortfall.
    const code = rotation ? null : i === 7 ? 'WR-24-CRI-01' : rng.pick(subscriptionLots);
    const lot: DemoLot | null = code ? catalogue.lotByCode(code) : null;
    const roastLevel: RoastLevel = lot
      ? rng.chance(0.5)
        ? lot.suggestedLevel
        : rng.pick(lot.allowedLevels)
      : rng.pick(['light', 'medium', 'medium', 'medium-dark'] as const);
    const dark = roastLevel === 'medium-dark' || roastLevel === 'dark' || roastLevel === 'french';
    const brewMethod: BrewMethod = rng.chance(dark ? 0.6 : 0.25) ? 'espresso' : 'filter';
    const grind: Grind =
      brewMethod === 'espresso'
        ? rng.pick(['whole-bean', 'whole-bean', 'espresso', 'moka-pot'] as const)
        : rng.pick(['whole-bean', 'whole-bean', 'pour-over', 'drip', 'french-press', 'hand-press', 'cold-brew'] as const);
    const bagSize = rng.pick(['12oz', '12oz', '1lb', '1lb', '2lb'] as const);
    const bagsPerDelivery = rng.pick([1, 1, 1, 2, 2, 3]);
    const cadenceWeeks = rng.pick([1, 2, 2, 2, 3, 4, 4]);
    const weekday = rng.pick(settings.roastWeekdays);
    const phase = rng.int(0, cadenceWeeks - 1);
    const priceCents = SUBSCRIPTION_BAG_PRICE_CENTS[bagSize] * bagsPerDelivery;
    const address = accounts.addressOf(userId);
    const subscriptionId = rng.uuid();
    const name = accounts.nameOf(userId);
    const coffee = lot?.name ?? roastersRotationName;
    const plan: SubscriptionOrderPlan = {
      subscriptionId,
      userId,
      name,
      code,
      coffee,
      roastLevel,
      brewMethod,
      grind,
      bagSize,
      bagsPerDelivery,
      priceCents,
      address,
    };

    // Dates: the subscriber's roast weekday, every `cadenceWeeks` weeks; a closure moves a delivery on.
    const firstBase = cal.addDays(cal.weekdayOnOrAfter(today, weekday), 7 * phase);
    const pastRoast = cal.addDays(firstBase, -7 * cadenceWeeks);
    const createdAt = status === 'incomplete' ? clock.daysAgo(0, 130) : cal.at(cal.addDays(pastRoast, -rng.int(2, 10)), '19:30');
    const pausedUntil = status === 'paused' ? cal.addDays(today, 7 * rng.int(2, 5)) : null;
    const upcoming: string[] = [];
    if (status !== 'cancelled' && status !== 'incomplete') {
      for (let k = 0; upcoming.length < 3 && k < 40; k += 1) {
        const date = cal.openRoastDayFrom(cal.addDays(firstBase, 7 * cadenceWeeks * k));
        if (pausedUntil && date < pausedUntil) continue;
        if (!upcoming.includes(date)) upcoming.push(date);
      }
    }
    const cancelledAt = status === 'cancelled' ? earlier(cal.at(cal.addDays(pastRoast, 2), '10:15'), clock.daysAgo(0, 240)) : null;
    const firstUnbilled = upcoming.find((d) => d > cal.addDays(today, 14));
    rows.subscriptions.push({
      id: subscriptionId,
      userId,
      status,
      lotId: code ? catalogue.lotId(code) : null,
      roastLevel,
      bagSize,
      bagsPerDelivery,
      grind,
      brewMethod,
      cadenceWeeks,
      pausedUntil,
      shippingAddress: address,
      stripeSubscriptionId: status === 'incomplete' ? null : `sub_demo_${rng.hex(8)}`,
      stripeCustomerId: stripeCustomerOf(userId),
      priceCents,
      currentPeriodEnd: status === 'active' && firstUnbilled ? cal.at(cal.addDays(firstUnbilled, -settings.cutoffDaysBefore), settings.cutoffTime) : null,
      cancelledAt,
      createdAt,
      updatedAt: cancelledAt ?? createdAt,
    });
    if (status === 'incomplete') continue;
    const makeOrder = (dates: DeliveryDates, orderStatus: OrderStatus) => billDelivery(ctx, rows, plan, dates, orderStatus, pickedLotOn);

    // The previous delivery (already roasted; shipped once its ship date has passed).
    let sequence = 1;
    {
      const dates = cal.datesFor(pastRoast, brewMethod, roastLevel);
      const packedToday = dates.shipDate === today && cal.clock >= `${today} 09:30`;
      const orderStatus: OrderStatus = dates.shipDate < today ? 'shipped' : packedToday ? 'packed' : 'roasted';
      const orderId = makeOrder(dates, orderStatus);
      const at = cal.at(pastRoast, '12:00');
      rows.deliveries.push({
        id: rng.uuid(),
        subscriptionId,
        orderId,
        sequence,
        ...dates,
        status: orderStatus === 'shipped' ? 'shipped' : 'roasted',
        createdAt: createdAt,
        updatedAt: at,
      });
      sequence += 1;
    }
    // The next deliveries: paid orders on the roast days of the next two weeks.
    upcoming.forEach((roastDate, k) => {
      const dates = cal.datesFor(roastDate, brewMethod, roastLevel);
      const held = status === 'past_due' && k === 0;
      const skipped = status === 'active' && i % 9 === 8 && k === 0;
      let orderId: string | null = null;
      if (held) orderId = makeOrder(dates, 'held');
      else if (!skipped && status === 'active' && roastDate <= cal.addDays(today, 14)) orderId = makeOrder(dates, 'paid');
      rows.deliveries.push({
        id: rng.uuid(),
        subscriptionId,
        orderId,
        sequence,
        ...dates,
        status: held ? 'held' : skipped ? 'skipped' : 'scheduled',
        createdAt,
        updatedAt: createdAt,
      });
      sequence += 1;
    });
    outbox.queue(
      'subscription-started',
      userId,
      subscriptionId,
      { name, subscriptionId, coffee, size: bagSize, roastLevel, grind, brewMethod, cadenceWeeks, priceCents, currency: CURRENCY, firstRoastDate: pastRoast },
      createdAt,
    );
  }
  return rows;
}

/** The order one delivery bills, with its line and the e-mails it sends. Returns the order's id. */
function billDelivery(
  { rng, clock, cal, catalogue, outbox }: ScenarioContext,
  rows: SubscriptionRows,
  plan: SubscriptionOrderPlan,
  dates: DeliveryDates,
  orderStatus: OrderStatus,
  pickedLotOn: (roastDate: string) => string,
): string {
  const { subscriptionId, userId, name, code, coffee, roastLevel, brewMethod, grind, bagSize, bagsPerDelivery, priceCents, address } = plan;
  const { now } = clock;
  const id = rng.uuid();
  const billedAt = earlier(cal.at(cal.addDays(dates.roastDate, -8), '06:00'), new Date(now.getTime() - rng.int(1, 30) * HOUR_MS));
  const paid = orderStatus !== 'held';
  const packedAt = orderStatus === 'packed' || orderStatus === 'shipped' ? cal.at(dates.shipDate, '09:30') : null;
  const shippedAt = orderStatus === 'shipped' ? cal.at(dates.shipDate, '16:00') : null;
  const item: Insert<typeof schema.orderItems> = {
    id: rng.uuid(),
    orderId: id,
    lotId: code ? catalogue.lotId(code) : null,
    kind: 'roasted',
    size: bagSize,
    quantity: bagsPerDelivery,
    fillGrams: FILL_GRAMS[bagSize],
    roastLevel,
    grind,
    brewMethod,
    unitPriceCents: SUBSCRIPTION_BAG_PRICE_CENTS[bagSize],
    lineTotalCents: priceCents,
  };
  // Drawn in the row's column order, so the PRNG sequence (and every demo value after it) is unchanged.
  const shipment = shippedAt
    ? { shippedAt, carrier: rng.pick(['Kestrel Post', 'Larkspur Freight']), trackingNumber: `WR-DEMO-${rng.hex(5).toUpperCase()}` }
    : null;
  const stripeInvoiceId = `in_demo_${rng.hex(8)}`;
  rows.orders.push({
    id,
    userId,
    kind: 'roasted',
    status: orderStatus,
    subscriptionId,
    subtotalCents: priceCents,
    shippingCents: 0,
    totalCents: priceCents,
    shippingAddress: address,
    ...dates,
    carrier: shipment?.carrier ?? null,
    trackingNumber: shipment?.trackingNumber ?? null,
    stripeInvoiceId,
    stripePaymentIntentId: paid ? `pi_demo_${rng.hex(8)}` : null,
    paidAt: paid ? billedAt : null,
    packedAt,
    shippedAt,
    createdAt: billedAt,
    updatedAt: shippedAt ?? packedAt ?? billedAt,
  });
  rows.orderItems.push(item);
  if (dates.roastDate < cal.today) {
    const emailLine = { description: coffee, size: bagSize, quantity: bagsPerDelivery, lineTotalCents: priceCents, roastLevel, grind };
    rows.roastedLines.push({
      roastDate: dates.roastDate,
      lotId: code ? catalogue.lotId(code) : pickedLotOn(dates.roastDate),
      level: roastLevel,
      item,
      userId,
      roastedEmail: { name, orderId: id, roastDate: dates.roastDate, lines: [emailLine], shipDate: dates.shipDate, readyFrom: dates.readyFrom },
    });
  }
  if (shipment) {
    const { carrier, trackingNumber } = shipment;
    outbox.queue(
      'shipped',
      userId,
      id,
      {
        name,
        orderId: id,
        kind: 'roasted',
        carrier,
        trackingNumber,
        trackingUrl: demoTrackingUrl(carrier, trackingNumber),
        readyFrom: dates.readyFrom,
        bestBefore: dates.bestBefore,
      },
      shipment.shippedAt,
    );
    outbox.queue(
      'rest-day',
      userId,
      id,
      { name, orderId: id, readyFrom: dates.readyFrom, brewMethod, coffee, bestBefore: dates.bestBefore },
      shipment.shippedAt,
      cal.at(dates.readyFrom, '08:00'),
    );
  }
  if (!paid) {
    // Keyed by the invoice that failed, as the payment webhook keys it.
    outbox.queue('payment-failed', userId, stripeInvoiceId, { name, amountCents: priceCents, currency: CURRENCY, subscriptionId, orderId: id }, billedAt);
  }
  return id;
}
