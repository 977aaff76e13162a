import { and, count, eq, like } from 'drizzle-orm';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { defaultShopSettings } from '@shared/schemas/settings';
import {
  subscriptionCheckoutResponseSchema,
  subscriptionDeliveriesResponseSchema,
  subscriptionSchema,
  type SubscriptionDelivery,
} from '@shared/schemas/subscriptions';
import { emailOutbox, subscriptions } from '../../server/db/schema/index';
import { createAdjustableClock } from '../../server/lib/clock';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { subscriptionRow, testStripe } from './payments-support';
import { createLotForSale, createTestUser, createWeeklySubscription, rotationCheckoutRequest, shipTo } from '../factories/index';

// The shop runs on Restday's default settings here (shared/schemas/settings.ts): New York time,
// roasting Monday, Wednesday and Friday, cutoff 12:00 the day before, filter rest 2 days,
// degassing hold 1 day, best-before 28 days, ship Monday to Friday.
// Monday 6 January 2031, 10:00 in New York (EST, UTC−5).
const monday10am = new Date('2031-01-06T15:00:00Z');
const clock = createAdjustableClock();
clock.set(monday10am);
const app = createTestApp({ clock });
const stripe = testStripe();

// Other test files change the shared test database's settings; this one needs the defaults.
beforeAll(async () => {
  await saveShopSettings(getTestDb(), defaultShopSettings);
});

async function deliveriesOf(agent: Awaited<ReturnType<typeof signedInAgent>>, id: string, count = 4): Promise<SubscriptionDelivery[]> {
  const response = await agent.get(`/api/subscriptions/${id}/deliveries?count=${count}`);
  expect(response.status).toBe(200);
  return subscriptionDeliveriesResponseSchema.parse(response.body).items;
}

const brief = (items: SubscriptionDelivery[]) =>
  items.map((item) => `${item.roastDate} ${item.status}${item.locked ? ' locked' : ''} ${item.roastLevel} ${item.grind}`);

async function changeEmails(subscriptionId: string) {
  const [row] = await getTestDb()
    .select({ n: count() })
    .from(emailOutbox)
    .where(and(eq(emailOutbox.template, 'subscription-changed'), like(emailOutbox.dedupeKey, `subscription-changed:${subscriptionId}:%`)));
  return row!.n;
}

async function signedIn() {
  const user = await createTestUser('customer');
  return { user, agent: await signedInAgent(app, user) };
}

describe('POST /api/checkout/subscription', () => {
  it('with saveAddress keeps the shipping address in the address book as the default', async () => {
    const { agent } = await signedIn();
    const response = await agent.post('/api/checkout/subscription').send({ ...rotationCheckoutRequest, saveAddress: true });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const book = await agent.get('/api/account/addresses');
    expect(book.body.items).toEqual([expect.objectContaining({ ...shipTo, line2: null, country: 'US', isDefault: true })]);
  });

  it('prices one delivery with the trade engine, creates the subscription incomplete and opens a weekly-recurring checkout', async () => {
    const lot = await createLotForSale(20_000);
    const { user, agent } = await signedIn();
    const response = await agent.post('/api/checkout/subscription').send({
      lotCode: lot.code,
      roastLevel: 'light',
      bagSize: '12oz',
      bagsPerDelivery: 2,
      grind: 'pour-over',
      brewMethod: 'filter',
      cadenceWeeks: 2,
      shippingAddress: shipTo,
    });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const { subscriptionId, checkoutUrl } = subscriptionCheckoutResponseSchema.parse(response.body);
    expect(checkoutUrl.startsWith(`${inject('stripeFakeUrl')}/test-payment/`)).toBe(true);

    // 2 × $18.00 (default 12 oz roasted price) = $36.00, less the 10 % subscription discount = $32.40;
    // parcel 2 × (341 g + 20 g bag) + 180 g box = 902 g → the ≤ 1 kg band, $8.95 (Restday default bands): $41.35.
    const row = await subscriptionRow(subscriptionId);
    expect(row).toMatchObject({ userId: user.id, status: 'incomplete', roastLevel: 'light', grind: 'pour-over', cadenceWeeks: 2, priceCents: 4135 });
    const session = await stripe.checkout.sessions.retrieve(row.stripeCheckoutSessionId!, { expand: ['line_items'] });
    expect(session.mode).toBe('subscription');
    expect(session.amount_total).toBe(4135);
    expect(session.line_items?.data[0]?.price?.recurring).toMatchObject({ interval: 'week', interval_count: 2 });
    // Leaving the payment page returns to the builder with these choices, not its defaults.
    const cancelUrl = new URL(session.cancel_url!);
    expect(cancelUrl.pathname).toBe('/subscribe');
    expect(Object.fromEntries(cancelUrl.searchParams)).toEqual({
      lot: lot.code,
      level: 'light',
      size: '12oz',
      bags: '2',
      grind: 'pour-over',
      brew: 'filter',
      every: '2',
      checkout: 'cancelled',
    });
  });

  it("the Roaster's Rotation takes any level; a lot refuses a level it does not offer with 422 naming roastLevel", async () => {
    const lot = await createLotForSale(20_000);
    const { agent } = await signedIn();
    const base = { bagSize: '1lb', bagsPerDelivery: 1, grind: 'whole-bean', brewMethod: 'espresso', cadenceWeeks: 1, shippingAddress: shipTo };
    const rotation = await agent.post('/api/checkout/subscription').send({ ...base, lotCode: null, roastLevel: 'french' });
    expect(rotation.status).toBe(201);

    const refused = await agent.post('/api/checkout/subscription').send({ ...base, lotCode: lot.code, roastLevel: 'dark' });
    expect(refused.status).toBe(422);
    expect(apiErrorSchema.parse(refused.body).error.fields).toHaveProperty('roastLevel');
  });

  it('bad input answers 400 naming each field and creates nothing', async () => {
    const { user, agent } = await signedIn();
    const response = await agent.post('/api/checkout/subscription').send({
      lotCode: null,
      roastLevel: 'blond',
      bagSize: '5lb',
      bagsPerDelivery: 11,
      grind: 'whole-bean',
      brewMethod: 'siphon',
      cadenceWeeks: 6,
      shippingAddress: { ...shipTo, postalCode: '' },
    });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {}).sort()).toEqual(
      ['bagSize', 'bagsPerDelivery', 'brewMethod', 'cadenceWeeks', 'roastLevel', 'shippingAddress.postalCode'].sort(),
    );
    const [row] = await getTestDb().select({ n: count() }).from(subscriptions).where(eq(subscriptions.userId, user.id));
    expect(row!.n).toBe(0);
  });
});

describe('GET /api/subscriptions and /api/subscriptions/:id/deliveries', () => {
  it('lists the grid from the anchor with roast, ship, ready-from and best-before dates; a delivery past its cutoff is locked', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id, lot } = await createWeeklySubscription(user);
    const items = await deliveriesOf(agent, id, 3);
    // Monday 6 Jan roasts today; its cutoff was Sunday 5 Jan 12:00, so it is locked. Monday 13 Jan's cutoff
    // (Sunday 12 Jan 12:00) is ahead. Ship: the first weekday on or after roast + 1 day's hold (Tuesday);
    // ready-from: roast + 2 days' filter rest; best-before: roast + 28 days.
    expect(
      items.map(({ roastDate, shipDate, readyFrom, bestBefore, locked, status }) => ({ roastDate, shipDate, readyFrom, bestBefore, locked, status })),
    ).toEqual([
      { roastDate: '2031-01-06', shipDate: '2031-01-07', readyFrom: '2031-01-08', bestBefore: '2031-02-03', locked: true, status: 'scheduled' },
      { roastDate: '2031-01-13', shipDate: '2031-01-14', readyFrom: '2031-01-15', bestBefore: '2031-02-10', locked: false, status: 'scheduled' },
      { roastDate: '2031-01-20', shipDate: '2031-01-21', readyFrom: '2031-01-22', bestBefore: '2031-02-17', locked: false, status: 'scheduled' },
    ]);
    expect(items[1]!.cutoffAt).toBe('2031-01-12T17:00:00.000Z');
    expect(items[0]).toMatchObject({ lotCode: lot.code, coffee: lot.name, bagSize: '12oz', bagsPerDelivery: 2, orderId: null });

    const list = await agent.get('/api/subscriptions');
    expect(list.status).toBe(200);
    const [only] = list.body.items as unknown[];
    expect(subscriptionSchema.parse(only)).toMatchObject({
      id,
      coffee: lot.name,
      lotCode: lot.code,
      nextDelivery: { roastDate: '2031-01-06' },
      cancelAtPeriodEnd: false,
    });
  });

  it('only the owner can read or change a subscription: anyone else gets 404 and nothing changes', async () => {
    clock.set(monday10am);
    const { user } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const other = await signedIn();
    expect((await other.agent.get(`/api/subscriptions/${id}`)).status).toBe(404);
    expect((await other.agent.get(`/api/subscriptions/${id}/deliveries`)).status).toBe(404);
    expect((await other.agent.patch(`/api/subscriptions/${id}`).send({ roastLevel: 'light' })).status).toBe(404);
    expect((await other.agent.post(`/api/subscriptions/${id}/skip`)).status).toBe(404);
    expect((await other.agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01' })).status).toBe(404);
    expect((await other.agent.post(`/api/subscriptions/${id}/cancel`)).status).toBe(404);
    expect((await other.agent.get('/api/subscriptions')).body).toEqual({ items: [] });
    expect(await subscriptionRow(id)).toMatchObject({ roastLevel: 'medium', pausedUntil: null, cancelAtPeriodEnd: false, changeVersion: 0 });
    expect(await changeEmails(id)).toBe(0);
  });
});

describe('changing a subscription', () => {
  it('a change after the cutoff moves the following delivery, never the locked one', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);

    const changed = await agent.patch(`/api/subscriptions/${id}`).send({ roastLevel: 'light' });
    expect(changed.status).toBe(200);
    expect(subscriptionSchema.parse(changed.body).roastLevel).toBe('light');
    expect(brief(await deliveriesOf(agent, id, 3))).toEqual([
      '2031-01-06 scheduled locked medium whole-bean',
      '2031-01-13 scheduled light whole-bean',
      '2031-01-20 scheduled light whole-bean',
    ]);

    // Sunday 12 January at 12:00 in New York: Monday 13's cutoff has just passed (it passes at the instant itself).
    clock.set(new Date('2031-01-12T17:00:00Z'));
    await agent.patch(`/api/subscriptions/${id}`).send({ grind: 'drip' });
    expect(brief(await deliveriesOf(agent, id, 3))).toEqual([
      '2031-01-13 scheduled locked light whole-bean',
      '2031-01-20 scheduled light drip',
      '2031-01-27 scheduled light drip',
    ]);
    const refused = await agent.post(`/api/subscriptions/${id}/skip`).send({ roastDate: '2031-01-13' });
    expect(refused.status).toBe(409);
    expect(apiErrorSchema.parse(refused.body).error.code).toBe('delivery_locked');

    // One minute earlier the same change would still have reached Monday 13.
    clock.set(new Date('2031-01-12T16:59:00Z'));
    const { user: early, agent: earlyAgent } = await signedIn();
    const { id: earlyId } = await createWeeklySubscription(early);
    await earlyAgent.patch(`/api/subscriptions/${earlyId}`).send({ grind: 'drip' });
    expect(brief(await deliveriesOf(earlyAgent, earlyId, 1))).toEqual(['2031-01-13 scheduled medium drip']);
  });

  it('skip takes the next unlocked delivery, shows at once, and skipping again changes nothing', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const first = await agent.post(`/api/subscriptions/${id}/skip`);
    expect(first.status).toBe(200);
    const again = await agent.post(`/api/subscriptions/${id}/skip`);
    expect(again.status).toBe(200);
    // The same subscription; only the notice differs ("already skipped").
    expect({ ...again.body, notice: undefined }).toEqual({ ...first.body, notice: undefined });
    expect((await deliveriesOf(agent, id, 3)).map((item) => `${item.roastDate} ${item.status}`)).toEqual([
      '2031-01-06 scheduled',
      '2031-01-13 skipped',
      '2031-01-20 scheduled',
    ]);
    expect(await changeEmails(id)).toBe(1);

    // A later one by its roast date.
    expect((await agent.post(`/api/subscriptions/${id}/skip`).send({ roastDate: '2031-01-27' })).status).toBe(200);
    expect((await deliveriesOf(agent, id, 5)).filter((item) => item.status === 'skipped').map((item) => item.roastDate)).toEqual(['2031-01-13', '2031-01-27']);
    const missing = await agent.post(`/api/subscriptions/${id}/skip`).send({ roastDate: '2031-01-28' });
    expect(missing.status).toBe(422);
    expect(apiErrorSchema.parse(missing.body).error.fields).toHaveProperty('roastDate');
  });

  it('pause and resume: deliveries before the day are gone at once (the locked one stays); both are idempotent', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const paused = await agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01' });
    expect(paused.status).toBe(200);
    expect(subscriptionSchema.parse(paused.body)).toMatchObject({ status: 'paused', pausedUntil: '2031-02-01' });
    expect((await agent.post(`/api/subscriptions/${id}/pause`).send({ until: '2031-02-01' })).status).toBe(200);
    // The grid's next Monday on or after Saturday 1 February is 3 February.
    expect((await deliveriesOf(agent, id, 3)).map((item) => item.roastDate)).toEqual(['2031-01-06', '2031-02-03', '2031-02-10']);

    const resumed = await agent.post(`/api/subscriptions/${id}/resume`);
    expect(subscriptionSchema.parse(resumed.body)).toMatchObject({ status: 'active', pausedUntil: null });
    expect((await agent.post(`/api/subscriptions/${id}/resume`)).status).toBe(200);
    expect((await deliveriesOf(agent, id, 3)).map((item) => item.roastDate)).toEqual(['2031-01-06', '2031-01-13', '2031-01-20']);
    expect(await changeEmails(id)).toBe(2);
  });

  it('cancel ends it at the period end: no further deliveries, one e-mail however often it is asked', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user, { currentPeriodEnd: new Date('2031-01-10T17:00:00Z') });
    const cancelled = await agent.post(`/api/subscriptions/${id}/cancel`);
    expect(subscriptionSchema.parse(cancelled.body)).toMatchObject({ cancelAtPeriodEnd: true, endsOn: '2031-01-10' });
    expect((await agent.post(`/api/subscriptions/${id}/cancel`)).status).toBe(200);
    // Only the locked delivery (frozen when the change was made) is still coming.
    expect((await deliveriesOf(agent, id, 3)).map((item) => item.roastDate)).toEqual(['2031-01-06']);
    expect(await changeEmails(id)).toBe(1);
  });

  it('a new cadence starts at the first unlocked delivery; the same PATCH again changes nothing', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    expect((await agent.patch(`/api/subscriptions/${id}`).send({ cadenceWeeks: 2 })).status).toBe(200);
    expect((await agent.patch(`/api/subscriptions/${id}`).send({ cadenceWeeks: 2 })).status).toBe(200);
    expect((await deliveriesOf(agent, id, 3)).map((item) => item.roastDate)).toEqual(['2031-01-06', '2031-01-13', '2031-01-27']);
    expect(await changeEmails(id)).toBe(1);
    expect(await subscriptionRow(id)).toMatchObject({ anchorDate: '2031-01-13', changeVersion: 1 });
  });

  it('a new size reprices the delivery with the trade engine', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const changed = await agent.patch(`/api/subscriptions/${id}`).send({ bagSize: '2lb', bagsPerDelivery: 1 });
    // 1 × $44.00 (default 2 lb price) less 10 % = $39.60; 908 g + 20 g + 180 g = 1,108 g → the ≤ 2 kg band, $11.95: $51.55.
    expect(subscriptionSchema.parse(changed.body)).toMatchObject({ bagSize: '2lb', bagsPerDelivery: 1, priceCents: 5155 });
  });

  it('bad input answers 400 naming the field and changes nothing', async () => {
    clock.set(monday10am);
    const { user, agent } = await signedIn();
    const { id } = await createWeeklySubscription(user);
    const cases: [string, object, string][] = [
      ['patch', { bagsPerDelivery: 11 }, 'bagsPerDelivery'],
      ['patch', { cadenceWeeks: 5 }, 'cadenceWeeks'],
      ['patch', { grind: 'powder' }, 'grind'],
      ['pause', { until: 'next week' }, 'until'],
      ['pause', { until: '2031-01-06' }, 'until'],
      ['skip', { roastDate: '13/01/2031' }, 'roastDate'],
    ];
    for (const [action, body, field] of cases) {
      const response =
        action === 'patch' ? await agent.patch(`/api/subscriptions/${id}`).send(body) : await agent.post(`/api/subscriptions/${id}/${action}`).send(body);
      expect(response.status, `${action} ${JSON.stringify(body)}`).toBe(400);
      expect(apiErrorSchema.parse(response.body).error.fields, `${action} ${JSON.stringify(body)}`).toHaveProperty(field);
    }
    expect((await agent.patch(`/api/subscriptions/${id}`).send({})).status).toBe(400);
    expect((await agent.get(`/api/subscriptions/${id}/deliveries?count=0`)).status).toBe(400);
    expect(await subscriptionRow(id)).toMatchObject({ changeVersion: 0, pausedUntil: null });
  });
});
