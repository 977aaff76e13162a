// DEMO SCENARIO SEED. EVERYTHING IN IT IS INVENTED: the shop (Wrenfield Roastworks), its town
// (Wrenfield, Colorado), its team and customers, their addresses, every farm, producer, cooperative
// and mill, every order, subscription, batch, journal entry and e-mail. Only the coffee origins and
// regions are real places. Payment ids (cs_test_demo_…, sub_demo_…), tracking numbers (WR-DEMO-…)
// and e-mail addresses (.test domains) are fake by construction.
//
// Deterministic: a fixed-seed PRNG (random.ts) drives every choice and makes every id, so the same
// `now` always gives the same rows. Idempotent: a database that already has the shop_settings row is
// left alone ({ seeded: false }). The whole seed runs in one transaction behind an advisory lock.
import { sql } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import { parseEmailPayload, renderSubject, type EmailPayloads, type EmailTemplateName } from '../../../emails/index';
import {
  roastersRotationName,
  type BagSize,
  type BrewMethod,
  type Grind,
  type OrderStatus,
  type RoastLevel,
  type RoastedBagSize,
  type Role,
  type SubscriptionStatus,
} from '../../../shared/domain/vocabulary';
import type { Db } from '../client';
import { hashPassword } from '../../lib/password-hashing';
import * as schema from '../schema/index';
import { defaultLossModel, estimateLevelFromLoss, lossPctOf } from '../../../shared/domain/roast-loss';
import { defaultShopSettings } from '../../../shared/schemas/settings';
import type { AddressSnapshot } from '../schema/index';
import type { DemoCalendar, DeliveryDates } from './demo-dates';
import { demoCalendar } from './demo-dates';
import type { DemoLot } from './demo-lots';
import { demoLots } from './demo-lots';
import { DEMO_CUSTOMER_EMAIL, DEMO_PASSWORD, demoCustomers, demoShop, demoStreets, demoTeam, demoTowns } from './demo-people';
import { DEMO_SEED, mulberry32 } from './random';

export { DEMO_PASSWORD } from './demo-people';

/** The demo accounts to print at start-up (all invented). Every demo customer shares the password. */
export const demoSignIns: { role: Role; label: string; email: string; password: string }[] = [
  { role: 'owner', label: 'Owner (Maren Atwood)', email: 'owner@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'staff', label: 'Roaster (Dario Quist)', email: 'roaster@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'staff', label: 'Packer (Lena Porter)', email: 'packer@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'customer', label: 'Home roaster and subscriber (Robin Alder)', email: DEMO_CUSTOMER_EMAIL, password: DEMO_PASSWORD },
];

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Insert<T extends PgTable> = T['$inferInsert'];

/** Fill weight of each bag size: the declared quantity rounded up to a whole gram (PRODUCT.md). */
const FILL_GRAMS: Record<BagSize, number> = { '8oz': 227, '12oz': 341, '1lb': 454, '2lb': 908, '5lb': 2268 };
/** Invented subscription prices per bag (cents), shipping included. */
const SUBSCRIPTION_BAG_PRICE_CENTS: Record<RoastedBagSize, number> = { '12oz': 1800, '1lb': 2300, '2lb': 4300 };
/** Invented flat shipping for green orders under the free-shipping line. */
const GREEN_SHIPPING_CENTS = 850;
const FREE_SHIPPING_FROM_CENTS = 7500;
/** Orders and subscriptions take the columns' default currency; the e-mails name it. */
const CURRENCY = 'usd';
/** Key of the advisory lock that keeps two concurrent seeds from both inserting. */
const SEED_LOCK_KEY = 7_302_451;

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;

export type DemoScenario = ReturnType<typeof buildDemoScenario>;

/**
 * Seed the demo scenario unless the database already has a shop. One transaction; about 0.3–0.7 s here.
 * Returns { seeded: false } (and changes nothing) on a database that is already seeded.
 */
export async function seedDemo(db: Db, options: { now: Date }): Promise<{ seeded: boolean }> {
  if (await hasShop(db)) return { seeded: false };
  const scenario = buildDemoScenario(options.now, await hashDemoPassword());
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${SEED_LOCK_KEY})`);
    if (await hasShop(tx)) return { seeded: false };
    await insertScenario(tx, scenario);
    return { seeded: true };
  });
}

async function hasShop(db: Db | Tx): Promise<boolean> {
  const rows = await db.select({ id: schema.shopSettings.id }).from(schema.shopSettings).limit(1);
  return rows.length > 0;
}

/**
 * Hash the shared demo password once (argon2id, OWASP parameters). The salt is fixed and derived
 * from the demo seed so the seed stays deterministic; acceptable only because the password itself
 * is public demo data. Real sign-ups get a random salt from the auth module.
 */
async function hashDemoPassword(): Promise<string> {
  const salt = mulberry32(DEMO_SEED ^ 0x00a2_90d1).bytes(16);
  return hashPassword(DEMO_PASSWORD, salt);
}

async function insertMany<T extends PgTable>(tx: Tx, table: T, rows: Insert<T>[]): Promise<void> {
  for (let i = 0; i < rows.length; i += 400) {
    await tx.insert(table).values(rows.slice(i, i + 400));
  }
}

async function insertScenario(tx: Tx, sc: DemoScenario): Promise<void> {
  await tx.insert(schema.shopSettings).values(sc.settings);
  await insertMany(tx, schema.roastDays, sc.roastDays);
  await insertMany(tx, schema.users, sc.users);
  await insertMany(tx, schema.addresses, sc.addresses);
  await insertMany(tx, schema.lots, sc.lots);
  await insertMany(tx, schema.lotPriceBreaks, sc.priceBreaks);
  await insertMany(tx, schema.subscriptions, sc.subscriptions);
  // orders ↔ deliveries point at each other: insert orders first, then deliveries, then link back.
  await insertMany(tx, schema.orders, sc.orders);
  await insertMany(tx, schema.orderItems, sc.orderItems);
  await insertMany(tx, schema.deliveries, sc.deliveries);
  await tx.execute(
    sql`update ${schema.orders} set delivery_id = d.id from ${schema.deliveries} d where d.order_id = ${schema.orders.id}`,
  );
  await insertMany(tx, schema.rotationPicks, sc.rotationPicks);
  await insertMany(tx, schema.batches, sc.batches);
  await insertMany(tx, schema.bagAllocations, sc.bagAllocations);
  await insertMany(tx, schema.stockMovements, sc.stockMovements);
  await insertMany(tx, schema.journalEntries, sc.journalEntries);
  await insertMany(tx, schema.emailOutbox, sc.outbox);
}

const earlier = (a: Date, b: Date) => (a.getTime() <= b.getTime() ? a : b);

/** Build every demo row in memory (pure: same `now` and hash → same rows). */
export function buildDemoScenario(now: Date, passwordHash: string) {
  const rng = mulberry32(DEMO_SEED);
  /** `days` days and `minutes` minutes before `now` (rounded down to the hour, for tidy demo times). */
  const daysAgo = (days: number, minutes = 10) => new Date(Math.floor(now.getTime() / HOUR_MS) * HOUR_MS - days * DAY_MS - minutes * 60_000);

  // ── Shop settings (invented shop; values are the TRADE.md defaults) ──────────────────────────
  const settings = {
    id: 1,
    shopName: demoShop.shopName,
    timeZone: demoShop.timeZone,
    roastWeekdays: [2, 4],
    cutoffTime: '12:00',
    cutoffDaysBefore: 1,
    shipWeekdays: [1, 2, 3, 4, 5],
    transitDays: 3,
    degasHoldDays: 1,
    restDaysFilter: 2,
    restDaysEspresso: 7,
    // Darker roasts rest less (TRADE.md, Smrke et al. 2017; the days from memory).
    restAdjustDays: defaultShopSettings.restAdjustDays,
    shipPolicy: 'ready_on_arrival',
    holdOverWeekend: true,
    bestBeforeDays: 28,
    overagePct: 3,
    roasterCapacityGrams: 6000,
    minLoadPct: 50,
    maxLoadPct: 80,
    dailyCapacityGrams: 48_000,
    lossModel: defaultLossModel,
    updatedAt: daysAgo(30),
  } satisfies Insert<typeof schema.shopSettings>;
  const model = settings.lossModel;

  // ── Roast Calendar overrides (invented holiday and maintenance day) ──────────────────────────
  const plain = demoCalendar(now, settings);
  const ahead = plain.roastWeekdaysFromToday(12);
  const [founderDay, maintenanceDay, shortDay] = [ahead[3] as string, ahead[11] as string, ahead[1] as string];
  const roastDays: Insert<typeof schema.roastDays>[] = [
    { date: founderDay, open: false, shipOpen: false, note: "Wrenfield Founders' Day (invented town holiday): roastery and shipping closed", createdAt: daysAgo(40), updatedAt: daysAgo(40) },
    { date: maintenanceDay, open: false, note: 'Roaster maintenance: afterburner service (invented)', createdAt: daysAgo(12), updatedAt: daysAgo(12) },
    { date: shortDay, open: true, capacityGrams: 30_000, note: 'Short day: cupping training in the afternoon (invented)', createdAt: daysAgo(9), updatedAt: daysAgo(9) },
  ];
  // The maintenance day closes roasting only: parcels still go out.
  const cal: DemoCalendar = demoCalendar(now, settings, new Set([founderDay, maintenanceDay]), new Set([founderDay]));
  const today = cal.today;

  // ── People (invented) ────────────────────────────────────────────────────────────────────────
  const users: Insert<typeof schema.users>[] = [];
  const addresses: Insert<typeof schema.addresses>[] = [];
  const userIdByEmail = new Map<string, string>();
  const addressByUser = new Map<string, AddressSnapshot>();
  for (const person of [...demoTeam, ...demoCustomers]) {
    const id = rng.uuid();
    const createdAt = daysAgo(person.joinedDaysAgo, rng.int(0, 600));
    users.push({ id, email: person.email, name: person.name, passwordHash, role: person.role, createdAt, updatedAt: createdAt });
    userIdByEmail.set(person.email, id);
    if (person.role === 'customer') {
      // Invented street address in an invented town.
      const town = rng.pick(demoTowns);
      const address: AddressSnapshot = {
        name: person.name,
        line1: `${rng.int(12, 4980)} ${rng.pick(demoStreets)}`,
        line2: rng.chance(0.25) ? `Apt ${rng.int(1, 40)}` : null,
        city: town.city,
        region: town.region,
        postalCode: `${town.postalPrefix}${String(rng.int(0, 99)).padStart(2, '0')}`,
        country: 'US',
      };
      addressByUser.set(id, address);
      addresses.push({ id: rng.uuid(), userId: id, ...address, isDefault: true, createdAt, updatedAt: createdAt });
    }
  }
  const idOf = (email: string) => userIdByEmail.get(email) as string;
  const roasterId = idOf('roaster@wrenfield.test');
  const packerId = idOf('packer@wrenfield.test');
  const ownerId = idOf('owner@wrenfield.test');
  const customerIds = demoCustomers.map((c) => idOf(c.email));
  const demoCustomerId = idOf(DEMO_CUSTOMER_EMAIL);
  const emailOf = new Map(users.map((u) => [u.id as string, u.email]));
  const nameById = new Map(users.map((u) => [u.id as string, u.name]));
  const nameOf = (userId: string) => nameById.get(userId) as string;

  // ── Green lots (invented producers) ──────────────────────────────────────────────────────────
  const lotIdByCode = new Map<string, string>();
  const lotByCode = new Map<string, DemoLot>(demoLots.map((l) => [l.code, l]));
  const lots: Insert<typeof schema.lots>[] = [];
  const priceBreaks: Insert<typeof schema.lotPriceBreaks>[] = [];
  for (const lot of demoLots) {
    const id = rng.uuid();
    lotIdByCode.set(lot.code, id);
    const createdAt = daysAgo(lot.arrivedDaysAgo, 600);
    const { priceBreaks: breaks, arrivedDaysAgo: _arrived, rotation: _rotation, ...columns } = lot;
    // Invented staff habit: reorder once a lot is down to 20 lb (9,072 g), so low lots raise the alert.
    lots.push({ id, ...columns, reorderPointGrams: 9_072, isListed: true, createdAt, updatedAt: createdAt });
    for (const [minGrams, pricePerKgCents] of breaks) priceBreaks.push({ id: rng.uuid(), lotId: id, minGrams, pricePerKgCents });
  }
  const lotId = (code: string) => lotIdByCode.get(code) as string;
  const lotCodeById = new Map([...lotIdByCode].map(([code, id]) => [id, code]));
  const rotationLots = demoLots.filter((l) => l.rotation).map((l) => l.code);

  const stockMovements: Insert<typeof schema.stockMovements>[] = [];
  const outbox: Insert<typeof schema.emailOutbox>[] = [];
  /** Like the outbox repo's queueEmail: the payload must fit its template (a misfit fails the seed, not the relay). */
  const queueEmail = <T extends EmailTemplateName>(template: T, userId: string, key: string, payload: EmailPayloads[T], createdAt: Date, sendAfter: Date = createdAt) => {
    const parsed = parseEmailPayload(template, payload);
    const sent = sendAfter.getTime() <= now.getTime();
    outbox.push({
      id: rng.uuid(),
      template,
      toAddress: emailOf.get(userId) as string,
      subject: renderSubject(template, parsed),
      payload,
      dedupeKey: `${template}:${key}`,
      status: sent ? 'sent' : 'pending',
      attempts: sent ? 1 : 0,
      sendAfter,
      sentAt: sent ? new Date(sendAfter.getTime() + 60_000) : null,
      createdAt,
    });
  };

  // ── Roaster's Rotation picks (invented staff choices), past four weeks to two weeks ahead ────
  const rotationPicks: Insert<typeof schema.rotationPicks>[] = [];
  const pickByDate = new Map<string, string>();
  for (let d = cal.addDays(today, -35), i = 0; d <= cal.addDays(today, 14); d = cal.addDays(d, 1)) {
    if (!cal.isOpenRoastDay(d)) continue;
    const code = rotationLots[i % rotationLots.length] as string;
    i += 1;
    pickByDate.set(d, lotId(code));
    const createdAt = earlier(cal.at(cal.addDays(d, -6), '09:00'), daysAgo(0, 30));
    rotationPicks.push({ roastDate: d, lotId: lotId(code), note: 'Demo pick (invented)', pickedBy: roasterId, createdAt, updatedAt: createdAt });
  }

  // ── Subscriptions and their deliveries (invented subscribers) ────────────────────────────────
  const subscriptions: Insert<typeof schema.subscriptions>[] = [];
  const deliveries: Insert<typeof schema.deliveries>[] = [];
  const orders: Insert<typeof schema.orders>[] = [];
  const orderItems: Insert<typeof schema.orderItems>[] = [];
  const stripeCustomer = new Map<string, string>();
  const stripeCustomerOf = (userId: string) => {
    if (!stripeCustomer.has(userId)) stripeCustomer.set(userId, `cus_demo_${rng.hex(7)}`);
    return stripeCustomer.get(userId) as string;
  };
  /** Roasted lines of past roast days, for the batches and "roasted" e-mails below (lotId resolved for Roaster's Rotation). */
  const roastedLines: { roastDate: string; lotId: string; level: RoastLevel; item: Insert<typeof schema.orderItems>; userId: string; roastedEmail: EmailPayloads['roasted'] }[] = [];

  // Mostly active; a few paused, one past due, one cancelled, one whose checkout never finished.
  const statusPlan: Record<number, SubscriptionStatus> = { 5: 'paused', 17: 'paused', 26: 'paused', 11: 'past_due', 23: 'cancelled', 31: 'incomplete' };
  const rotationPlan = new Set([3, 9, 14, 20, 29]);
  const subscriptionLots = ['WR-24-ETH-01', 'WR-24-ETH-02', 'WR-24-COL-01', 'WR-24-COL-01', 'WR-24-GTM-01', 'WR-24-GTM-01', 'WR-24-BRA-01', 'WR-24-BRA-01', 'WR-24-BRA-01', 'WR-24-SUM-01', 'WR-25-PER-01', 'WR-25-RWA-01'];
  const SUBSCRIPTIONS = 36;

  for (let i = 0; i < SUBSCRIPTIONS; i += 1) {
    const status = statusPlan[i] ?? 'active';
    const userId = i === 0 || i === 3 ? demoCustomerId : (customerIds[1 + (i % (customerIds.length - 1))] as string);
    const rotation = rotationPlan.has(i);
    // One subscriber on the low-stock lot, so a roast list shows a shortfall.
    const code = rotation ? null : i === 7 ? 'WR-24-CRI-01' : rng.pick(subscriptionLots);
    const lot = code ? (lotByCode.get(code) as DemoLot) : null;
    const roastLevel: RoastLevel = lot ? (rng.chance(0.5) ? lot.suggestedLevel : rng.pick(lot.allowedLevels)) : rng.pick(['light', 'medium', 'medium', 'medium-dark'] as const);
    const dark = roastLevel === 'medium-dark' || roastLevel === 'dark' || roastLevel === 'french';
    const brewMethod: BrewMethod = rng.chance(dark ? 0.6 : 0.25) ? 'espresso' : 'filter';
    const grind: Grind =
      brewMethod === 'espresso'
        ? rng.pick(['whole-bean', 'whole-bean', 'espresso', 'moka-pot'] as const)
        : rng.pick(['whole-bean', 'whole-bean', 'pour-over', 'drip', 'french-press', 'aeropress', 'cold-brew'] as const);
    const bagSize = rng.pick(['12oz', '12oz', '1lb', '1lb', '2lb'] as const);
    const bagsPerDelivery = rng.pick([1, 1, 1, 2, 2, 3]);
    const cadenceWeeks = rng.pick([1, 2, 2, 2, 3, 4, 4]);
    const weekday = rng.pick(settings.roastWeekdays);
    const phase = rng.int(0, cadenceWeeks - 1);
    const priceCents = SUBSCRIPTION_BAG_PRICE_CENTS[bagSize] * bagsPerDelivery;
    const address = addressByUser.get(userId) as AddressSnapshot;
    const subscriptionId = rng.uuid();
    const name = nameOf(userId);
    const coffee = lot?.name ?? roastersRotationName;
    const emailLine = { description: coffee, size: bagSize, quantity: bagsPerDelivery, lineTotalCents: priceCents, roastLevel, grind };

    // Dates: the subscriber's roast weekday, every `cadenceWeeks` weeks; a closure moves a delivery on.
    const firstBase = cal.addDays(cal.weekdayOnOrAfter(today, weekday), 7 * phase);
    const pastRoast = cal.addDays(firstBase, -7 * cadenceWeeks);
    const createdAt = status === 'incomplete' ? daysAgo(0, 130) : cal.at(cal.addDays(pastRoast, -rng.int(2, 10)), '19:30');
    const pausedUntil = status === 'paused' ? cal.addDays(today, 7 * rng.int(2, 5)) : null;
    const upcoming: string[] = [];
    if (status !== 'cancelled' && status !== 'incomplete') {
      for (let k = 0; upcoming.length < 3 && k < 40; k += 1) {
        const date = cal.openRoastDayFrom(cal.addDays(firstBase, 7 * cadenceWeeks * k));
        if (pausedUntil && date < pausedUntil) continue;
        if (!upcoming.includes(date)) upcoming.push(date);
      }
    }
    const cancelledAt = status === 'cancelled' ? earlier(cal.at(cal.addDays(pastRoast, 2), '10:15'), daysAgo(0, 240)) : null;
    const firstUnbilled = upcoming.find((d) => d > cal.addDays(today, 14));
    subscriptions.push({
      id: subscriptionId,
      userId,
      status,
      lotId: code ? lotId(code) : null,
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

    const makeOrder = (dates: DeliveryDates, orderStatus: OrderStatus): string => {
      const id = rng.uuid();
      const billedAt = earlier(cal.at(cal.addDays(dates.roastDate, -8), '06:00'), new Date(now.getTime() - rng.int(1, 30) * HOUR_MS));
      const paid = orderStatus !== 'held';
      const packedAt = orderStatus === 'packed' || orderStatus === 'shipped' ? cal.at(dates.shipDate, '09:30') : null;
      const shippedAt = orderStatus === 'shipped' ? cal.at(dates.shipDate, '16:00') : null;
      const item: Insert<typeof schema.orderItems> = {
        id: rng.uuid(),
        orderId: id,
        lotId: code ? lotId(code) : null,
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
      const shipment = shippedAt ? { shippedAt, carrier: rng.pick(['USPS', 'UPS']), trackingNumber: `WR-DEMO-${rng.hex(5).toUpperCase()}` } : null;
      const stripeInvoiceId = `in_demo_${rng.hex(8)}`;
      orders.push({
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
      orderItems.push(item);
      if (dates.roastDate < today) {
        roastedLines.push({
          roastDate: dates.roastDate,
          lotId: code ? lotId(code) : (pickByDate.get(dates.roastDate) as string),
          level: roastLevel,
          item,
          userId,
          roastedEmail: { name, orderId: id, roastDate: dates.roastDate, lines: [emailLine], shipDate: dates.shipDate, readyFrom: dates.readyFrom },
        });
      }
      if (shipment) {
        const { carrier, trackingNumber } = shipment;
        queueEmail('shipped', userId, id, { name, orderId: id, kind: 'roasted', carrier, trackingNumber, readyFrom: dates.readyFrom, bestBefore: dates.bestBefore }, shipment.shippedAt);
        queueEmail('rest-day', userId, id, { name, orderId: id, readyFrom: dates.readyFrom, brewMethod, coffee, bestBefore: dates.bestBefore }, shipment.shippedAt, cal.at(dates.readyFrom, '08:00'));
      }
      if (!paid) {
        // Keyed by the invoice that failed, as the payment webhook keys it.
        queueEmail('payment-failed', userId, stripeInvoiceId, { name, amountCents: priceCents, currency: CURRENCY, subscriptionId, orderId: id }, billedAt);
      }
      return id;
    };

    // The previous delivery (already roasted; shipped once its ship date has passed).
    let sequence = 1;
    {
      const dates = cal.datesFor(pastRoast, brewMethod, roastLevel);
      const packedToday = dates.shipDate === today && cal.clock >= `${today} 09:30`;
      const orderStatus: OrderStatus = dates.shipDate < today ? 'shipped' : packedToday ? 'packed' : 'roasted';
      const orderId = makeOrder(dates, orderStatus);
      const at = cal.at(pastRoast, '12:00');
      deliveries.push({ id: rng.uuid(), subscriptionId, orderId, sequence, ...dates, status: orderStatus === 'shipped' ? 'shipped' : 'roasted', createdAt: createdAt, updatedAt: at });
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
      deliveries.push({
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
    queueEmail(
      'subscription-started',
      userId,
      subscriptionId,
      { name, subscriptionId, coffee, size: bagSize, roastLevel, grind, brewMethod, cadenceWeeks, priceCents, currency: CURRENCY, firstRoastDate: pastRoast },
      createdAt,
    );
  }

  // ── Batches for past roast days (invented weights; loss drawn around the level default) ─────
  const batches: Insert<typeof schema.batches>[] = [];
  const bagAllocations: Insert<typeof schema.bagAllocations>[] = [];
  const groups = new Map<string, typeof roastedLines>();
  for (const line of [...roastedLines].sort((a, b) => (a.roastDate + a.lotId + a.level).localeCompare(b.roastDate + b.lotId + b.level))) {
    const key = `${line.roastDate}|${line.lotId}|${line.level}`;
    groups.set(key, [...(groups.get(key) ?? []), line]);
  }
  const levelSeconds: Record<RoastLevel, [number, number]> = {
    light: [600, 75],
    medium: [660, 100],
    'medium-dark': [720, 125],
    dark: [780, 160],
    french: [840, 200],
  };
  const maxLoad = (settings.roasterCapacityGrams * settings.maxLoadPct) / 100;
  const minLoad = (settings.roasterCapacityGrams * settings.minLoadPct) / 100;
  let batchCounter = 0;
  const batchesPerDay = new Map<string, number>();
  for (const [, lines] of groups) {
    const { roastDate, lotId: batchLotId, level } = lines[0] as (typeof lines)[number];
    const loss = model[level];
    const roastedNeeded = lines.reduce((sum, l) => sum + (l.item.quantity as number) * (l.item.fillGrams as number), 0);
    const greenNeeded = Math.ceil((roastedNeeded * (1 + settings.overagePct / 100)) / (1 - loss.defaultPct / 100));
    const count = Math.max(1, Math.ceil(greenNeeded / maxLoad));
    const perBatch = Math.max(minLoad, Math.ceil(greenNeeded / count));
    const groupBatchIds: string[] = [];
    for (let b = 0; b < count; b += 1) {
      batchCounter += 1;
      const nth = batchesPerDay.get(roastDate) ?? 0;
      batchesPerDay.set(roastDate, nth + 1);
      // Every eleventh batch ran long: outside the expected range, so the flag has something to show.
      const lossPct = batchCounter % 11 === 5 ? loss.maxPct + 1.2 : loss.defaultPct + (rng.next() - 0.5) * (loss.maxPct - loss.minPct) * 0.8;
      const greenGramsIn = perBatch + rng.int(0, 9);
      const roastedGramsOut = Math.round(greenGramsIn * (1 - lossPct / 100));
      const recordedLoss = lossPctOf(greenGramsIn, roastedGramsOut);
      const [total, development] = levelSeconds[level];
      const totalSeconds = total + rng.int(-30, 30);
      const id = rng.uuid();
      const createdAt = cal.at(roastDate, `${String(8 + Math.floor(nth / 3)).padStart(2, '0')}:${String((nth % 3) * 20).padStart(2, '0')}`);
      batches.push({
        id,
        roastDate,
        lotId: batchLotId,
        roastLevel: level,
        greenGramsIn,
        roastedGramsOut,
        totalSeconds,
        firstCrackSeconds: totalSeconds - development - rng.int(0, 15),
        operatorId: roasterId,
        lossPct: recordedLoss,
        withinExpected: recordedLoss >= loss.minPct && recordedLoss <= loss.maxPct,
        notes: recordedLoss > loss.maxPct ? 'Ran long: missed the drop by about 20 s (invented)' : '',
        createdAt,
      });
      groupBatchIds.push(id);
      stockMovements.push({ id: rng.uuid(), lotId: batchLotId, deltaGrams: -greenGramsIn, reason: 'roast', note: '', batchId: id, actorId: roasterId, createdAt });
    }
    lines.forEach((line, n) => {
      bagAllocations.push({
        id: rng.uuid(),
        batchId: groupBatchIds[n % groupBatchIds.length] as string,
        orderItemId: line.item.id as string,
        orderId: line.item.orderId,
        bags: line.item.quantity,
        grams: (line.item.quantity as number) * (line.item.fillGrams as number),
        createdAt: cal.at(roastDate, '15:00'),
      });
    });
  }
  // One "roasted" e-mail per order roasted on a past roast day (each roasted order has one line).
  for (const line of roastedLines) queueEmail('roasted', line.userId, line.item.orderId, line.roastedEmail, cal.at(line.roastDate, '17:00'));

  // ── One-time green orders (invented customers and baskets) ──────────────────────────────────
  const priceFor = (lot: DemoLot, lineGrams: number) =>
    lot.priceBreaks.reduce((price, [minGrams, breakPrice]) => (lineGrams >= minGrams ? Math.min(price, breakPrice) : price), lot.pricePerKgCents);
  const sellable = demoLots.filter((l) => l.stockGrams > 5_000).map((l) => l.code);
  type GreenPlan = { userId: string; hoursAgo: number; basket: [string, BagSize, number][]; status?: OrderStatus };
  const greenPlans: GreenPlan[] = [
    // Order history: the demo customer's first order (the lots of their Roast Journal) and an old sell-out.
    { userId: demoCustomerId, hoursAgo: 35 * 24 + 5, basket: [['WR-24-ETH-01', '1lb', 1], ['WR-24-BRA-01', '2lb', 1], ['WR-24-GTM-01', '1lb', 1]] },
    { userId: customerIds[3] as string, hoursAgo: 20 * 24 + 3, basket: [['WR-24-KEN-01', '5lb', 2]] },
    { userId: customerIds[8] as string, hoursAgo: 26 * 24 + 7, basket: [['WR-24-KEN-01', '5lb', 1], ['WR-24-CRI-01', '2lb', 1]] },
    { userId: demoCustomerId, hoursAgo: 60, basket: [['WR-25-RWA-01', '1lb', 1], ['WR-24-CRI-01', '8oz', 1]] },
  ];
  // Placed over the past week: the newest are awaiting payment or ship next, the oldest have shipped.
  const recentHours = [2, 3, 5, 7, 9, 13, 17, 22, 30, 41, 52, 64, 75, 88, 99, 112, 124, 137, 150, 163];
  const pendingAt = new Set([1, 6, 7]);
  recentHours.forEach((hoursAgo, n) => {
    const userId = rng.pick(customerIds.slice(1));
    const lines = rng.int(1, 3);
    const basket: [string, BagSize, number][] = [];
    for (let l = 0; l < lines; l += 1) {
      const code = rng.pick(sellable);
      if (basket.some(([c]) => c === code)) continue;
      basket.push([code, rng.pick(['8oz', '1lb', '1lb', '2lb', '5lb'] as const), rng.pick([1, 1, 2])]);
    }
    greenPlans.push({ userId, hoursAgo, basket, status: pendingAt.has(n) ? 'pending_payment' : n === 12 ? 'refunded' : undefined });
  });

  for (const plan of greenPlans) {
    const id = rng.uuid();
    const createdAt = new Date(Math.floor(now.getTime() / 60_000) * 60_000 - plan.hoursAgo * HOUR_MS);
    const pending = plan.status === 'pending_payment';
    const paidAt = pending ? null : new Date(createdAt.getTime() + 2 * 60_000);
    const paidDate = paidAt ? localDate(paidAt, settings.timeZone) : null;
    const shipDate = paidDate ? cal.nextShipDay(paidDate) : null;
    let status: OrderStatus = plan.status ?? 'paid';
    if (!plan.status && shipDate) {
      if (shipDate < today) status = 'shipped';
      else if (shipDate === today && cal.clock >= `${today} 09:30`) status = 'packed';
    }
    const packedAt = shipDate && (status === 'shipped' || status === 'packed') ? cal.at(shipDate, '09:30') : null;
    const shippedAt = shipDate && status === 'shipped' ? cal.at(shipDate, '16:00') : null;
    const refundedAt = status === 'refunded' && paidAt ? new Date(paidAt.getTime() + 20 * HOUR_MS) : null;
    let subtotalCents = 0;
    const emailLines: EmailPayloads['order-confirmed']['lines'] = [];
    for (const [code, size, quantity] of plan.basket) {
      const lot = lotByCode.get(code) as DemoLot;
      const fillGrams = FILL_GRAMS[size];
      const unitPriceCents = Math.round((fillGrams * priceFor(lot, fillGrams * quantity)) / 1000);
      subtotalCents += unitPriceCents * quantity;
      emailLines.push({ description: lot.name, size, quantity, lineTotalCents: unitPriceCents * quantity });
      orderItems.push({ id: rng.uuid(), orderId: id, lotId: lotId(code), kind: 'green', size, quantity, fillGrams, unitPriceCents, lineTotalCents: unitPriceCents * quantity });
      // Stock is taken when checkout reserves it (pending included) and returned on a refund.
      stockMovements.push({ id: rng.uuid(), lotId: lotId(code), deltaGrams: -fillGrams * quantity, reason: 'sale', note: '', orderId: id, createdAt });
      if (refundedAt) stockMovements.push({ id: rng.uuid(), lotId: lotId(code), deltaGrams: fillGrams * quantity, reason: 'refund', note: 'Refunded before packing (invented)', orderId: id, actorId: ownerId, createdAt: refundedAt });
    }
    const shippingCents = subtotalCents >= FREE_SHIPPING_FROM_CENTS ? 0 : GREEN_SHIPPING_CENTS;
    const totalCents = subtotalCents + shippingCents;
    const shippingAddress = addressByUser.get(plan.userId) as AddressSnapshot;
    const orderShipDate = status === 'refunded' ? null : shipDate;
    // Drawn in the row's column order, so the PRNG sequence (and every demo value after it) is unchanged.
    const shipment = shippedAt ? { shippedAt, carrier: rng.pick(['USPS', 'UPS']), trackingNumber: `WR-DEMO-${rng.hex(5).toUpperCase()}` } : null;
    orders.push({
      id,
      userId: plan.userId,
      kind: 'green',
      status,
      subtotalCents,
      shippingCents,
      totalCents,
      shippingAddress,
      shipDate: orderShipDate,
      carrier: shipment?.carrier ?? null,
      trackingNumber: shipment?.trackingNumber ?? null,
      stripeCheckoutSessionId: `cs_test_demo_${rng.hex(12)}`,
      stripePaymentIntentId: paidAt ? `pi_demo_${rng.hex(8)}` : null,
      paidAt,
      packedAt,
      shippedAt,
      refundedCents: refundedAt ? totalCents : 0,
      createdAt,
      updatedAt: refundedAt ?? shippedAt ?? packedAt ?? paidAt ?? createdAt,
    });
    const name = nameOf(plan.userId);
    if (paidAt) {
      queueEmail(
        'order-confirmed',
        plan.userId,
        id,
        { name, orderId: id, kind: 'green', lines: emailLines, subtotalCents, shippingCents, totalCents, currency: CURRENCY, shipTo: shippingAddress, ...(orderShipDate ? { shipDate: orderShipDate } : {}) },
        paidAt,
      );
    }
    if (shipment) {
      const { carrier, trackingNumber } = shipment;
      queueEmail('shipped', plan.userId, id, { name, orderId: id, kind: 'green', carrier, trackingNumber }, shipment.shippedAt);
    }
  }

  // ── Roast Journal entries (invented home roasts of lots the customers bought) ────────────────
  const journalEntries: Insert<typeof schema.journalEntries>[] = [];
  const deviceProfile = {
    popper: { green: [78, 82], yellow: [95, 140], crack: [170, 230] },
    'stovetop-pan': { green: [140, 160], yellow: [240, 300], crack: [480, 560] },
    'drum-home': { green: [240, 260], yellow: [260, 320], crack: [500, 580] },
  } as const;
  const afterCrack: Record<RoastLevel, [number, number]> = { light: [5, 12], medium: [20, 30], 'medium-dark': [30, 40], dark: [55, 70], french: [85, 100] };
  const addJournal = (userId: string, code: string, roastedOn: string, device: keyof typeof deviceProfile) => {
    const lot = lotByCode.get(code) as DemoLot;
    const level = rng.chance(0.6) ? lot.suggestedLevel : rng.pick(lot.allowedLevels);
    const p = deviceProfile[device];
    const greenGrams = rng.int(p.green[0], p.green[1]);
    const lossTarget = model[level].minPct + rng.next() * (model[level].maxPct - model[level].minPct);
    const roastedGrams = Math.round(greenGrams * (1 - lossTarget / 100));
    const lossPct = lossPctOf(greenGrams, roastedGrams);
    const yellowSeconds = rng.int(p.yellow[0], p.yellow[1]);
    const firstCrackSeconds = rng.int(p.crack[0], p.crack[1]);
    const endSeconds = firstCrackSeconds + rng.int(afterCrack[level][0], afterCrack[level][1]);
    const createdAt = cal.at(roastedOn, '19:45');
    journalEntries.push({
      id: rng.uuid(),
      userId,
      lotId: lotId(code),
      device,
      roastedOn,
      greenGrams,
      roastedGrams,
      yellowSeconds,
      firstCrackSeconds,
      endSeconds,
      levelReached: rng.chance(0.8) ? level : null,
      estimatedLevel: estimateLevelFromLoss(lossPct, model).level,
      lossPct,
      developmentSeconds: endSeconds - firstCrackSeconds,
      notes: rng.pick(['', 'Windy on the porch; took longer to yellow.', 'Stirred constantly, even colour.', 'First crack was quiet, went by smell.', 'Cooled in a colander by the fan.']),
      createdAt,
      updatedAt: createdAt,
    });
  };
  // The demo customer's own journal (invented roasts).
  const journalPlan: [string, number, keyof typeof deviceProfile][] = [
    ['WR-24-GTM-01', 31, 'popper'],
    ['WR-24-GTM-01', 27, 'popper'],
    ['WR-24-ETH-01', 24, 'popper'],
    ['WR-24-BRA-01', 19, 'popper'],
    ['WR-24-ETH-01', 12, 'popper'],
    ['WR-24-BRA-01', 6, 'stovetop-pan'],
    ['WR-24-GTM-01', 2, 'popper'],
  ];
  for (const [code, ago, device] of journalPlan) addJournal(demoCustomerId, code, cal.addDays(today, -ago), device);
  // Other customers' roasts of lots from their shipped orders (anonymous in the per-lot summaries).
  for (const order of orders) {
    if (order.kind !== 'green' || order.status !== 'shipped' || order.userId === demoCustomerId || !order.shipDate) continue;
    const firstDay = cal.addDays(order.shipDate, 4);
    if (firstDay >= today) continue;
    const item = orderItems.find((it) => it.orderId === order.id) as Insert<typeof schema.orderItems>;
    const code = lotCodeById.get(item.lotId as string) as string;
    addJournal(order.userId, code, firstDay, rng.pick(['popper', 'popper', 'drum-home'] as const));
  }

  // ── Green stock history: arrival + samples + counts, so Σ movements = stock on hand ──────────
  stockMovements.push(
    { id: rng.uuid(), lotId: lotId('WR-24-ETH-01'), deltaGrams: -227, reason: 'sample', note: 'Cupping samples for the (invented) Wrenfield coffee club', actorId: roasterId, createdAt: daysAgo(50) },
    { id: rng.uuid(), lotId: lotId('WR-24-GTM-01'), deltaGrams: -140, reason: 'count', note: 'Stock count: spilled sack corner (invented)', actorId: packerId, createdAt: daysAgo(21) },
    { id: rng.uuid(), lotId: lotId('WR-24-BRA-01'), deltaGrams: -310, reason: 'loss', note: 'Torn sack, swept beans discarded (invented)', actorId: packerId, createdAt: daysAgo(44) },
  );
  for (const lot of demoLots) {
    const moved = stockMovements.filter((m) => m.lotId === lotId(lot.code)).reduce((sum, m) => sum + m.deltaGrams, 0);
    stockMovements.push({
      id: rng.uuid(),
      lotId: lotId(lot.code),
      deltaGrams: lot.stockGrams - moved,
      reason: 'arrival',
      note: `${Math.round((lot.stockGrams - moved) / 1000)} kg in hermetic-lined sacks from the (invented) importer`,
      actorId: roasterId,
      createdAt: daysAgo(lot.arrivedDaysAgo, 600),
    });
  }
  // A delivery that failed to send once, for the Outbox screen (invented).
  const retrying = outbox.find((m) => m.status === 'pending');
  if (retrying) Object.assign(retrying, { attempts: 2, lastError: 'connect ECONNREFUSED 127.0.0.1:1025 (demo: mail server was down)' });

  return {
    settings,
    roastDays,
    users,
    addresses,
    lots,
    priceBreaks,
    subscriptions,
    deliveries,
    orders,
    orderItems,
    rotationPicks,
    batches,
    bagAllocations,
    stockMovements,
    journalEntries,
    outbox,
  };
}

/** Shop-local calendar date of an instant. */
function localDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}

/** Used by tests: row counts per table that the seed fills. */
export const seededTables = {
  users: schema.users,
  addresses: schema.addresses,
  lots: schema.lots,
  lotPriceBreaks: schema.lotPriceBreaks,
  subscriptions: schema.subscriptions,
  deliveries: schema.deliveries,
  orders: schema.orders,
  orderItems: schema.orderItems,
  rotationPicks: schema.rotationPicks,
  batches: schema.batches,
  bagAllocations: schema.bagAllocations,
  stockMovements: schema.stockMovements,
  journalEntries: schema.journalEntries,
  emailOutbox: schema.emailOutbox,
  roastDays: schema.roastDays,
  shopSettings: schema.shopSettings,
} as const;

