// What a subscriber is told, and what really happens to their money: a skipped paid delivery's payment
// moves to the next one (and back on undo), a pause across a paid delivery asks ship or hold, a lot
// that cannot be roasted is never sold by subscription, and a delivery order's lines add up.
import { and, count, desc, eq, like } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { orderDetailSchema } from '@shared/schemas/orders';
import { defaultShopSettings } from '@shared/schemas/settings';
import { subscriptionChangeResponseSchema, subscriptionDeliveriesResponseSchema, type SubscriptionDelivery } from '@shared/schemas/subscriptions';
import { renderEmail } from '../../emails/index';
import { emailOutbox, subscriptions } from '../../server/db/schema/index';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { recordPaidCycle } from '../../server/modules/subscriptions/subscription-billing';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { orderRow, subscriptionRow, testStripe } from './payments-support';
import { createLotForSale, createTestUser, createWeeklySubscription, inventDelivery, inventDeliveryOrder, shipTo, type TestUser } from '../factories/index';

// Restday's default settings (shared/schemas/settings.ts): New York, roasting Monday, Wednesday and
// Friday, cutoff 12:00 the day before. Monday 6 January 2031, 10:00 in New York (EST, UTC−5).
const monday10am = new Date('2031-01-06T15:00:00Z');
const clock = createAdjustableClock();
const app = createTestApp({ clock });
const isoDay = /\b\d{4}-\d{2}-\d{2}\b/;

beforeAll(async () => {
  await saveShopSettings(getTestDb(), defaultShopSettings);
});

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

async function signedIn() {
  const user = await createTestUser('customer');
  return { user, agent: await signedInAgent(app, user) };
}

/** The same, with the delivery roasting Monday 13 January already paid (its cutoff, Sunday 12:00, is ahead). */
async function withPaidDelivery(owner: TestUser) {
  const subscription = await createWeeklySubscription(owner);
  const deliveryId = await inventDelivery(subscription.id, 1, '2031-01-13');
  const orderId = await inventDeliveryOrder(owner, subscription.id, deliveryId, {
    roastDate: '2031-01-13',
    size: '12oz',
    quantity: 2,
    lotId: subscription.lot.id,
  });
  return { ...subscription, orderId };
}

async function deliveriesOf(agent: Agent, id: string, count = 4): Promise<SubscriptionDelivery[]> {
  const response = await agent.get(`/api/subscriptions/${id}/deliveries?count=${count}`);
  expect(response.status).toBe(200);
  return subscriptionDeliveriesResponseSchema.parse(response.body).items;
}

const brief = (items: SubscriptionDelivery[]) => items.map((item) => `${item.roastDate} ${item.status}${item.paid ? ' paid' : ''}`);

/** The text part of the newest subscription-changed e-mail, rendered as the relay would send it. */
async function lastChangeEmail(subscriptionId: string) {
  const [row] = await getTestDb()
    .select()
    .from(emailOutbox)
    .where(and(eq(emailOutbox.template, 'subscription-changed'), like(emailOutbox.dedupeKey, `subscription-changed:${subscriptionId}:%`)))
    .orderBy(desc(emailOutbox.createdAt));
  const context = {
    shop: { name: 'Invented Test Roastery', postalAddress: '1 Invented Lane, Sampleville, CO 80000' },
    baseUrl: 'http://127.0.0.1',
    timeZone: 'America/New_York',
  };
  return renderEmail('subscription-changed', row!.payload, context);
}

describe('skipping a paid delivery, and undoing a skip', () => {
  it('Deliveries marks the paid one; skipping it says where the payment moves (written-out dates, also in the e-mail); undo brings the payment back', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id, orderId } = await withPaidDelivery(user);
    expect(brief(await deliveriesOf(agent, id, 3))).toEqual(['2031-01-06 scheduled', '2031-01-13 scheduled paid', '2031-01-20 scheduled']);

    const skipped = await agent.post(`/api/subscriptions/${id}/deliveries/2031-01-13/skip`);
    expect(skipped.status, JSON.stringify(skipped.body)).toBe(200);
    expect(subscriptionChangeResponseSchema.parse(skipped.body).notice).toBe(
      'Skipped the delivery roasting Monday, January 13, 2031. It is already paid, so your payment moves to the delivery of Monday, January 20, 2031.',
    );
    const afterSkip = await deliveriesOf(agent, id, 3);
    expect(brief(afterSkip)).toEqual(['2031-01-06 scheduled', '2031-01-13 skipped', '2031-01-20 scheduled paid']);
    expect(afterSkip[2]!.orderId).toBe(orderId);
    expect((await orderRow(orderId)).roastDate).toBe('2031-01-20');

    const mail = await lastChangeEmail(id);
    expect(mail.text).toContain('your payment moves to the delivery of Monday, January 20, 2031');
    expect(mail.text).not.toContain('not be charged');
    expect(mail.text).not.toMatch(isoDay);
    expect(mail.subject).not.toMatch(isoDay);

    const undone = await agent.post(`/api/subscriptions/${id}/deliveries/2031-01-13/unskip`);
    expect(undone.status, JSON.stringify(undone.body)).toBe(200);
    expect(subscriptionChangeResponseSchema.parse(undone.body).notice).toBe(
      'The delivery roasting Monday, January 13, 2031 is back on. Your payment moves back to it from the delivery of Monday, January 20, 2031.',
    );
    const afterUndo = await deliveriesOf(agent, id, 3);
    expect(brief(afterUndo)).toEqual(['2031-01-06 scheduled', '2031-01-13 scheduled paid', '2031-01-20 scheduled']);
    expect(afterUndo[1]!.orderId).toBe(orderId);
    expect((await orderRow(orderId)).roastDate).toBe('2031-01-13');
    expect((await lastChangeEmail(id)).text).not.toMatch(isoDay);

    // Undoing again changes nothing.
    const again = await agent.post(`/api/subscriptions/${id}/deliveries/2031-01-13/unskip`);
    expect(again.status).toBe(200);
    expect(brief(await deliveriesOf(agent, id, 3))).toEqual(brief(afterUndo));
  });

  it('an unpaid skip says it will not be charged; any upcoming delivery can be skipped, not only the next', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const later = await agent.post(`/api/subscriptions/${id}/deliveries/2031-01-27/skip`);
    expect(later.status).toBe(200);
    expect(subscriptionChangeResponseSchema.parse(later.body).notice).toBe(
      'Skipped the delivery roasting Monday, January 27, 2031. It will not be roasted, shipped or charged.',
    );
    expect(brief(await deliveriesOf(agent, id, 4))).toEqual(['2031-01-06 scheduled', '2031-01-13 scheduled', '2031-01-20 scheduled', '2031-01-27 skipped']);
    expect((await lastChangeEmail(id)).text).toContain('Monday, January 27, 2031');

    // The older body form still skips by date.
    expect((await agent.post(`/api/subscriptions/${id}/skip`).send({ roastDate: '2031-01-20' })).status).toBe(200);
    expect(brief(await deliveriesOf(agent, id, 4))).toEqual(['2031-01-06 scheduled', '2031-01-13 scheduled', '2031-01-20 skipped', '2031-01-27 skipped']);

    const bad = await agent.post(`/api/subscriptions/${id}/deliveries/27-01-2031/skip`);
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toHaveProperty('date');
  });

  it('after its cutoff a skip can no longer be undone: 409 delivery_locked, and it stays skipped', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    expect((await agent.post(`/api/subscriptions/${id}/deliveries/2031-01-13/skip`)).status).toBe(200);
    const version = (await subscriptionRow(id)).changeVersion;

    // Sunday 12 January 12:00 in New York: Monday 13's cutoff is this instant.
    clock.set(new Date('2031-01-12T17:00:00Z'));
    const refused = await agent.post(`/api/subscriptions/${id}/deliveries/2031-01-13/unskip`);
    expect(refused.status).toBe(409);
    const error = apiErrorSchema.parse(refused.body).error;
    expect(error.code).toBe('delivery_locked');
    expect(error.message).toContain('Monday, January 13, 2031');
    expect(error.message).not.toMatch(isoDay);
    expect((await deliveriesOf(agent, id, 1)).map((item) => `${item.roastDate} ${item.status}`)).toEqual(['2031-01-13 skipped']);
    expect((await subscriptionRow(id)).changeVersion).toBe(version);
  });
});

describe('pausing across a paid delivery', () => {
  it('without a choice: 409 paid_delivery_in_pause naming paidDelivery, and nothing changes', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await withPaidDelivery(user);
    const refused = await agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01' });
    expect(refused.status).toBe(409);
    const error = apiErrorSchema.parse(refused.body).error;
    expect(error.code).toBe('paid_delivery_in_pause');
    expect(error.fields).toHaveProperty('paidDelivery');
    expect(error.message).toContain('Monday, January 13, 2031');
    expect(await subscriptionRow(id)).toMatchObject({ pausedUntil: null, status: 'active', changeVersion: 0 });

    const bad = await agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01', paidDelivery: 'later' });
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toHaveProperty('paidDelivery');
  });

  it('ship: the paid one still roasts inside the pause and the answer says so; the status is paused at once', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id, orderId } = await withPaidDelivery(user);
    const paused = await agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01', paidDelivery: 'ship' });
    expect(paused.status, JSON.stringify(paused.body)).toBe(200);
    const body = subscriptionChangeResponseSchema.parse(paused.body);
    expect(body).toMatchObject({ status: 'paused', pausedUntil: '2031-02-01' });
    expect(body.notice).toBe('Paused until Saturday, February 1, 2031. The paid delivery roasting Monday, January 13, 2031 still roasts and ships.');
    // The grid's next Monday on or after Saturday 1 February is 3 February.
    expect(brief(await deliveriesOf(agent, id, 3))).toEqual(['2031-01-06 scheduled', '2031-01-13 scheduled paid', '2031-02-03 scheduled']);
    expect((await orderRow(orderId)).roastDate).toBe('2031-01-13');
    expect((await lastChangeEmail(id)).text).not.toMatch(isoDay);
  });

  it('hold: the payment moves to the first delivery after the pause', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id, orderId } = await withPaidDelivery(user);
    const paused = await agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01', paidDelivery: 'hold' });
    expect(paused.status, JSON.stringify(paused.body)).toBe(200);
    const body = subscriptionChangeResponseSchema.parse(paused.body);
    expect(body.status).toBe('paused');
    expect(body.notice).toBe(
      'Paused until Saturday, February 1, 2031. The paid delivery roasting Monday, January 13, 2031 is held: your payment moves to the delivery of Monday, February 3, 2031.',
    );
    const items = await deliveriesOf(agent, id, 3);
    expect(brief(items)).toEqual(['2031-01-06 scheduled', '2031-02-03 scheduled paid', '2031-02-10 scheduled']);
    expect(items[1]!.orderId).toBe(orderId);
    // Roast Monday 3 February; ship the next weekday after the 1-day hold; ready after 2 days' filter rest (Restday defaults).
    expect(await orderRow(orderId)).toMatchObject({ roastDate: '2031-02-03', shipDate: '2031-02-04', readyFrom: '2031-02-05' });
  });
});

describe('POST /api/checkout/subscription — a lot that cannot be roasted', () => {
  // One delivery of 2 × 12 oz at medium: 2 × 341 g fill = 682 g roasted; + 2 % overage (Restday default) = 695.64 g;
  // ÷ (1 − 0.15) medium loss (from memory; green = roasted ÷ (1 − loss), common practice) = 818.4 g → 819 g of green.
  const request = (lotCode: string) => ({
    lotCode,
    roastLevel: 'medium',
    bagSize: '12oz',
    bagsPerDelivery: 2,
    grind: 'whole-bean',
    brewMethod: 'filter',
    cadenceWeeks: 2,
    shippingAddress: shipTo,
  });

  async function sessionsFor(email: string) {
    const sessions = await testStripe().checkout.sessions.list({ limit: 100 });
    return sessions.data.filter((session) => session.customer_email === email);
  }

  it.each([
    ['no stock', 0],
    ['less than one delivery needs', 818],
  ])('%s: 409 lot_sold_out naming lotCode; no subscription row and no Stripe checkout', async (_case, stockGrams) => {
    clock.set(monday10am);
    const lot = await createLotForSale(stockGrams);
    const { user, agent } = await signedIn();
    const refused = await agent.post('/api/checkout/subscription').send(request(lot.code));
    expect(refused.status).toBe(409);
    const error = apiErrorSchema.parse(refused.body).error;
    expect(error.code).toBe('lot_sold_out');
    expect(error.fields).toHaveProperty('lotCode');
    const [row] = await getTestDb().select({ n: count() }).from(subscriptions).where(eq(subscriptions.userId, user.id));
    expect(row!.n).toBe(0);
    expect(await sessionsFor(user.email)).toEqual([]);
  });

  it('exactly one delivery’s green is enough to subscribe', async () => {
    clock.set(monday10am);
    const lot = await createLotForSale(819);
    const { user, agent } = await signedIn();
    const accepted = await agent.post('/api/checkout/subscription').send(request(lot.code));
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(201);
    expect(await sessionsFor(user.email)).toHaveLength(1);
  });
});

describe('a delivery order’s discount line', () => {
  it('GET /api/orders/:id shows bags, the subscription discount and shipping that add up to what was paid', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const logger = createLogger({ LOG_LEVEL: 'silent', NODE_ENV: 'test' });
    // $41.35 paid: 2 × $18.00 = $36.00 of bags, less the 10 % subscription discount $3.60, plus $8.95 shipping
    // for 2 × (341 g + 20 g bag) + 180 g box = 902 g in the ≤ 1 kg band (Restday defaults).
    const invoice = { id: `in_test_${id.slice(0, 8)}`, amountPaidCents: 4135, currency: 'usd', paymentIntentId: null };
    const orderId = await getTestDb().transaction((tx) => recordPaidCycle(tx, id, invoice, monday10am, logger));
    expect(orderId).toBeDefined();

    const response = await agent.get(`/api/orders/${orderId}`);
    expect(response.status).toBe(200);
    const order = orderDetailSchema.parse(response.body);
    expect(order).toMatchObject({ subtotalCents: 3600, discountCents: 360, discountLabel: 'Subscription discount', shippingCents: 895, totalCents: 4135 });
    expect(order.items.map((item) => item.lineTotalCents)).toEqual([3600]);
    expect(order.subtotalCents - order.discountCents + order.shippingCents).toBe(order.totalCents);
  });
});
