// Renewals driven by the payment fake's clock, end to end: the fake renews and sends signed webhooks
// to a real listening server, which turns each paid invoice into one delivery order.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { addDays, localDateOf } from '@shared/domain/shop-time';
import { subscriptionDeliveriesResponseSchema } from '@shared/schemas/subscriptions';
import { defaultShopSettings } from '@shared/schemas/settings';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { createPaymentsGateway } from '../../server/integrations/payments';
import { createLogger } from '../../server/lib/logger';
import { systemClock } from '../../server/lib/clock';
import { startServer, type RunningServer } from '../../server/index';
import { createStripeSync } from '../../server/modules/subscriptions/stripe-sync.service';
import { inboxOf, waitFor } from '../api/outbox-support';
import {
  deliveryRows,
  eventsAbout,
  outboxCount,
  paymentsTestConfig,
  settle,
  stripeFake,
  subscriptionOrders,
  subscriptionRow,
  testPaymentsService,
  testStripe,
} from '../api/payments-support';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { freePort } from '../setup/free-port';
import { startStripeRelay, type StripeRelay } from './stripe-relay';
import { createLotForSale, createSubscription, createTestUser } from '../factories/index';

// Stripe's published test card that saves to a customer and then fails every charge (Stripe docs, Testing).
const failsOnCharge = '4000000000000341';
const mailCatcherUrl = inject('mailCatcherUrl');
const fake = stripeFake();
const stripe = testStripe();

let server: RunningServer;
// The server reaches the fake through this relay, so an outage the test makes is an outage for the
// server's own every-minute Stripe sync too, not only for the test's push.
let relay: StripeRelay;
let lot: { id: string; name: string };
let payments: ReturnType<typeof testPaymentsService>;

beforeAll(async () => {
  // The whole server with its workers, on the test clock so a test can move the shop's time.
  const port = await freePort();
  relay = await startStripeRelay(inject('stripeFakeUrl'));
  const config = paymentsTestConfig({ PORT: String(port), RESTDAY_TEST_CLOCK: 'true', STRIPE_API_URL: relay.url });
  server = await startServer(config, createLogger(config));
  await fake.setWebhookEndpoint(`${server.url}/api/payments/webhook`);
  payments = testPaymentsService(config);
  lot = await createLotForSale(50_000);
});

afterAll(async () => {
  await fake.resumeWebhooks();
  await fake.setWebhookEndpoint(null);
  await server.stop();
  await relay.close();
});

/** Moves the running server's clock (scheduling, the ledger's paidAt). */
async function setShopClock(now: Date) {
  const response = await request(server.url).post('/api/dev/clock').set('X-Restday-Client', 'web').send({ now: now.toISOString() });
  expect(response.status).toBe(200);
}

/** A customer who can sign in, with a paid 2 × 12 oz fortnightly subscription and its first delivery order. */
async function paidSubscription() {
  const customer = await createTestUser('customer');
  const { id } = await createSubscription({ userId: customer.id, lotId: lot.id, bagsPerDelivery: 2, priceCents: 4135 });
  const { checkoutUrl } = await payments.createCheckoutForSubscription(id);
  expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
  await waitFor(
    () => subscriptionOrders(id),
    (orders) => orders.length === 1,
    10_000,
    'the first delivery order',
  );
  const subscription = await waitFor(
    () => subscriptionRow(id),
    (current) => current.status === 'active' && current.anchorDate !== null,
    10_000,
    'active',
  );
  return {
    customer,
    id,
    anchorDate: subscription.anchorDate!,
    stripeSubscriptionId: subscription.stripeSubscriptionId!,
    stripeCustomerId: subscription.stripeCustomerId!,
  };
}

describe('subscription renewals on the payment fake’s clock', () => {
  it('the first payment orders the first delivery on its anchor roast day; each renewal orders the next, once, even when its event is delivered twice', async () => {
    const { id, anchorDate, stripeSubscriptionId } = await paidSubscription();
    const [first] = await subscriptionOrders(id);
    // The first delivery roasts on the first open roast day whose cutoff (12:00 the day before) is still ahead.
    expect(first).toMatchObject({ kind: 'roasted', status: 'paid', roastDate: anchorDate, totalCents: 4135 });

    const renewal = await fake.advanceClock({ days: 14 });
    const renewed = renewal.renewals.find((entry) => entry.subscription === stripeSubscriptionId);
    expect(renewed).toMatchObject({ outcome: 'paid' });
    const orders = await waitFor(
      () => subscriptionOrders(id),
      (rows) => rows.length === 2,
      10_000,
      'the renewal order',
    );
    // The fortnightly grid: the second delivery's place is the anchor + 14 days.
    expect(orders[1]).toMatchObject({ stripeInvoiceId: renewed!.invoice, roastDate: addDays(anchorDate, 14), status: 'paid', totalCents: 4135 });

    const [paidEvent] = await eventsAbout(renewed!.invoice!, 'invoice.paid');
    expect((await fake.deliverEvent(paidEvent!.eventId)).statusCode).toBe(200);
    expect((await fake.deliverEvent(paidEvent!.eventId)).statusCode).toBe(200);
    await settle(500);
    expect(await subscriptionOrders(id)).toHaveLength(2);
    const rows = await deliveryRows(id);
    expect(rows.filter((delivery) => delivery.orderId !== null).map((delivery) => delivery.nominalDate)).toEqual([anchorDate, addDays(anchorDate, 14)]);
  });

  it('a failed renewal holds its delivery and sends one e-mail however often Stripe retries; paying later releases it to the next open roast day', async () => {
    const { customer, id, anchorDate, stripeSubscriptionId, stripeCustomerId } = await paidSubscription();
    await fake.setCustomerCard(stripeCustomerId, failsOnCharge);
    const renewal = await fake.advanceClock({ days: 14 });
    const failedInvoice = renewal.renewals.find((entry) => entry.subscription === stripeSubscriptionId)!.invoice!;
    const heldNominal = addDays(anchorDate, 14);
    await waitFor(
      () => deliveryRows(id),
      (rows) => rows.some((row) => row.nominalDate === heldNominal && row.status === 'held'),
      10_000,
      'the held delivery',
    );
    expect((await subscriptionRow(id)).status).toBe('past_due');
    await fake.advanceClock({ days: 3 });
    await waitFor(
      () => eventsAbout(failedInvoice, 'invoice.payment_failed'),
      (events) => events.length === 2 && events.every((event) => event.status === 'delivered'),
    );
    await settle();
    expect(await outboxCount(`payment-failed:${failedInvoice}`)).toBe(1);
    const inbox = await waitFor(
      () => inboxOf(mailCatcherUrl, customer.email),
      (mails) => mails.some((mail) => mail.subject === 'We could not take your payment'),
      15_000,
    );
    expect(inbox.filter((mail) => mail.subject === 'We could not take your payment')).toHaveLength(1);
    expect(await subscriptionOrders(id)).toHaveLength(1);

    // The customer pays two days after the held delivery's roast date: its cutoff is long gone.
    const paidAt = new Date(`${addDays(heldNominal, 2)}T15:00:00Z`);
    await setShopClock(paidAt);
    try {
      await fake.setCustomerCard(stripeCustomerId, succeedingTestCard);
      await stripe.invoices.pay(failedInvoice);
      const orders = await waitFor(
        () => subscriptionOrders(id),
        (rows) => rows.length === 2,
        10_000,
        'the released delivery order',
      );
      const released = orders[1]!;
      const row = (await deliveryRows(id)).find((delivery) => delivery.nominalDate === heldNominal)!;
      expect(row).toMatchObject({ status: 'scheduled', orderId: released.id, roastDate: released.roastDate });
      // Re-dated: later than its place on the grid, on a roast weekday, with its cutoff still ahead at payment.
      expect(released.roastDate! > heldNominal).toBe(true);
      const weekday = new Date(`${released.roastDate}T12:00:00Z`).getUTCDay();
      expect([1, 3, 5]).toContain(weekday); // Restday's default roast days: Monday, Wednesday, Friday.
      expect(released.roastDate! > localDateOf(paidAt, defaultShopSettings.timeZone)).toBe(true);
      expect((await subscriptionRow(id)).status).toBe('active');
    } finally {
      await setShopClock(new Date());
    }
  });

  it('a change reaches Stripe: new price and cadence without billing at once, pause, a skipped charge moved one cadence on, cancellation; pushing again changes nothing', async () => {
    const { customer, id, stripeSubscriptionId } = await paidSubscription();
    const app = createTestApp();
    const agent = await signedInAgent(app, customer);
    const sync = createStripeSync({
      db: getTestDb(),
      gateway: createPaymentsGateway(paymentsTestConfig()),
      clock: systemClock,
      logger: createLogger(paymentsTestConfig()),
    });
    const before = await stripe.subscriptions.retrieve(stripeSubscriptionId);
    const periodEnd = before.items.data[0]!.current_period_end;

    expect((await agent.patch(`/api/subscriptions/${id}`).send({ bagsPerDelivery: 3, cadenceWeeks: 3 })).status).toBe(200);
    // The running server's every-minute job may have pushed it first; either way Stripe must hold it.
    expect(['pushed', 'already']).toContain(await sync.push(id));
    const changed = await stripe.subscriptions.retrieve(stripeSubscriptionId, { expand: ['latest_invoice'] });
    // 3 × $18.00 less 10 % = $48.60; 3 × 361 g + 180 g = 1,263 g → ≤ 2 kg band $11.95: $60.55 (Restday defaults).
    expect(changed.items.data[0]!.price).toMatchObject({ unit_amount: 6055, recurring: { interval: 'week', interval_count: 3 } });
    expect(changed.items.data[0]!.current_period_end).toBe(periodEnd);
    expect(changed.latest_invoice).toMatchObject({ billing_reason: 'subscription_create' });
    expect(await sync.push(id)).toBe('already');

    // Skip the next delivery: it is already paid, so its payment carries to the one after, and the next charge moves one cadence (3 weeks) on.
    const skipped = await agent.post(`/api/subscriptions/${id}/skip`);
    expect(skipped.status).toBe(200);
    expect(['pushed', 'already']).toContain(await sync.push(id));
    const afterSkip = await stripe.subscriptions.retrieve(stripeSubscriptionId);
    expect(afterSkip.items.data[0]!.current_period_end).toBe(periodEnd + 21 * 86_400);
    const deliveries = subscriptionDeliveriesResponseSchema.parse((await agent.get(`/api/subscriptions/${id}/deliveries?count=3`)).body).items;
    expect(deliveries.map((delivery) => delivery.status)).toEqual(['skipped', 'scheduled', 'scheduled']);
    expect(deliveries[1]!.orderId).not.toBeNull();
    expect(await sync.push(id)).toBe('already');

    const until = addDays(localDateOf(new Date(), defaultShopSettings.timeZone), 30);
    // The delivery the skip's payment moved to lies inside the pause: it still ships.
    expect((await agent.post(`/api/subscriptions/${id}/pause`).send({ until, paidDelivery: 'ship' })).status).toBe(200);
    expect(['pushed', 'already']).toContain(await sync.push(id));
    expect((await stripe.subscriptions.retrieve(stripeSubscriptionId)).pause_collection).toMatchObject({ behavior: 'void' });
    expect((await agent.post(`/api/subscriptions/${id}/resume`)).status).toBe(200);
    expect((await agent.post(`/api/subscriptions/${id}/cancel`)).status).toBe(200);
    expect(['pushed', 'already']).toContain(await sync.push(id));
    const cancelled = await stripe.subscriptions.retrieve(stripeSubscriptionId);
    expect(cancelled).toMatchObject({ cancel_at_period_end: true, pause_collection: null });
    expect(await subscriptionRow(id)).toMatchObject({ stripeSyncedVersion: (await subscriptionRow(id)).changeVersion });
  });

  it('a Stripe outage leaves the change answered and recorded; the push succeeds once Stripe is back', async () => {
    const { customer, id, stripeSubscriptionId } = await paidSubscription();
    const agent = await signedInAgent(createTestApp(), customer);
    const logger = createLogger(paymentsTestConfig());
    relay.cut();
    try {
      expect((await agent.patch(`/api/subscriptions/${id}`).send({ bagSize: '1lb' })).status).toBe(200);
      const unreachable = createStripeSync({
        db: getTestDb(),
        gateway: createPaymentsGateway(paymentsTestConfig({ STRIPE_API_URL: relay.url })),
        clock: systemClock,
        logger,
      });
      await expect(unreachable.push(id)).rejects.toThrow();
      // Nobody could push it: not this push, not the server's scheduled sync.
      const row = await subscriptionRow(id);
      expect(row.stripeSyncedVersion).toBeLessThan(row.changeVersion);
    } finally {
      relay.restore();
    }

    // The scheduled job (every minute in the running server) or this push brings Stripe up to date.
    const sync = createStripeSync({ db: getTestDb(), gateway: createPaymentsGateway(paymentsTestConfig()), clock: systemClock, logger });
    await sync.pushAllBehind();
    // 2 × $23.00 less 10 % = $41.40; 2 × 474 g + 180 g = 1,128 g → ≤ 2 kg band $11.95: $53.35 (Restday defaults).
    expect((await stripe.subscriptions.retrieve(stripeSubscriptionId)).items.data[0]!.price.unit_amount).toBe(5335);
    const synced = await subscriptionRow(id);
    expect(synced.stripeSyncedVersion).toBe(synced.changeVersion);
  });

  it('a subscription Stripe does not know (the demo seed’s invented ids) is recorded as pushed instead of retried forever', async () => {
    const customer = await createTestUser('customer');
    const row = await createSubscription({
      userId: customer.id,
      status: 'active',
      cadenceWeeks: 1,
      anchorDate: '2031-01-06',
      changeVersion: 2,
      stripeSubscriptionId: 'sub_demo_invented01',
    });
    const sync = createStripeSync({
      db: getTestDb(),
      gateway: createPaymentsGateway(paymentsTestConfig()),
      clock: systemClock,
      logger: createLogger(paymentsTestConfig()),
    });
    expect(await sync.push(row.id)).toBe('nothing');
    expect(await subscriptionRow(row.id)).toMatchObject({ stripeSyncedVersion: 2 });
  });
});
