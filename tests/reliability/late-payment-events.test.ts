// A late payment notice never undoes a subscriber's change. The subscriber owns pause, skips, level
// and cadence; the payment service owns the money (paid, past due, cancelled by it). Here the server
// runs without workers, so no change reaches Stripe: every `customer.subscription.updated` it reads
// back is Stripe's state from before the change, as a notice sent for an earlier change would be.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, localDateOf } from '@shared/domain/shop-time';
import { defaultShopSettings } from '@shared/schemas/settings';
import { subscriptionDeliveriesResponseSchema, subscriptionSchema } from '@shared/schemas/subscriptions';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { paymentEvents } from '../../server/db/schema/index';
import { createLogger } from '../../server/lib/logger';
import { startServer, type RunningServer } from '../../server/index';
import { applyPaymentEventJob } from '../../server/jobs/payment-events';
import { startQueue, type Queue } from '../../server/jobs/queue';
import { workJobs } from '../../server/jobs/registry';
import { systemClock } from '../../server/lib/clock';
import { waitFor } from '../api/outbox-support';
import {
  eventsAbout,
  ledgerCount,
  paymentsTestConfig,
  stripeFake,
  subscriptionOrders,
  subscriptionRow,
  testPaymentsService,
  testStripe,
} from '../api/payments-support';
import { freePort } from '../setup/free-port';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createLotForSale, createSubscription, createTestUser } from '../factories/index';

const fake = stripeFake();
const stripe = testStripe();
const app = createTestApp();

let server: RunningServer;
let eventQueue: Queue | undefined;
let stopEventWork: (() => Promise<void>) | undefined;
let payments: ReturnType<typeof testPaymentsService>;
let lotId: string;

beforeAll(async () => {
  const port = await freePort();
  const config = paymentsTestConfig({ PORT: String(port), WORKERS_IN_SERVER: 'false' });
  server = await startServer(config, createLogger(config));
  // The server runs no workers (so nothing pushes the subscriber's changes to Stripe behind the
  // test's back); payment events are applied here, by their own job alone.
  eventQueue = await startQueue(config.DATABASE_URL, createLogger(config));
  stopEventWork = await workJobs(eventQueue, [applyPaymentEventJob], { db: getTestDb(), clock: systemClock, logger: createLogger(config), config });
  await fake.setWebhookEndpoint(`${server.url}/api/payments/webhook`);
  payments = testPaymentsService(config);
  lotId = (await createLotForSale(50_000)).id;
});

afterAll(async () => {
  await fake.resumeWebhooks();
  await fake.setWebhookEndpoint(null);
  await stopEventWork?.();
  await eventQueue?.stop();
  await server.stop();
});

/** A customer with a paid 2 × 12 oz fortnightly subscription (webhooks delivered as they happen). */
async function paidSubscription() {
  const customer = await createTestUser('customer');
  const { id } = await createSubscription({ userId: customer.id, lotId, bagsPerDelivery: 2, priceCents: 4135 });
  const { checkoutUrl } = await payments.createCheckoutForSubscription(id);
  expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
  await waitFor(
    () => subscriptionOrders(id),
    (orders) => orders.length === 1,
    10_000,
    'the first delivery order',
  );
  const active = await waitFor(
    () => subscriptionRow(id),
    (current) => current.status === 'active' && current.anchorDate !== null,
    10_000,
    'active',
  );
  return { id, stripeSubscriptionId: active.stripeSubscriptionId!, agent: await signedInAgent(app, customer) };
}

/**
 * A `customer.subscription.updated` the payment service sends for a change of its own, held back so
 * it arrives later (a metadata change: nothing Restday reads).
 */
async function heldUpdateEvent(stripeSubscriptionId: string, note: string) {
  const before = new Set((await eventsAbout(stripeSubscriptionId, 'customer.subscription.updated')).map((event) => event.eventId));
  await stripe.subscriptions.update(stripeSubscriptionId, { metadata: { restday_test_note: note } });
  const events = await eventsAbout(stripeSubscriptionId, 'customer.subscription.updated');
  const fresh = events.filter((event) => !before.has(event.eventId));
  expect(fresh).toHaveLength(1);
  return fresh[0]!.eventId;
}

async function deliver(eventId: string) {
  const attempt = await fake.deliverEvent(eventId);
  expect(attempt.statusCode).toBe(200);
}

const pauseUntil = () => addDays(localDateOf(new Date(), defaultShopSettings.timeZone), 30);

async function readSubscription(agent: Awaited<ReturnType<typeof signedInAgent>>, id: string) {
  const response = await agent.get(`/api/subscriptions/${id}`);
  expect(response.status).toBe(200);
  return subscriptionSchema.parse(response.body);
}

describe('late and out-of-order payment events against a subscriber’s changes', () => {
  it('a pause, then a stale customer.subscription.updated (twice): still paused', async () => {
    const { id, stripeSubscriptionId, agent } = await paidSubscription();
    await fake.pauseWebhooks();
    try {
      const stale = await heldUpdateEvent(stripeSubscriptionId, 'before the pause');
      const until = pauseUntil();
      const paused = await agent.post(`/api/subscriptions/${id}/pause`).send({ until, paidDelivery: 'ship' });
      expect(paused.status, JSON.stringify(paused.body)).toBe(200);
      expect(subscriptionSchema.parse(paused.body)).toMatchObject({ status: 'paused', pausedUntil: until });
      // Stripe still reads as it was: the change never reached it.
      expect((await stripe.subscriptions.retrieve(stripeSubscriptionId)).pause_collection).toBeNull();

      await deliver(stale);
      await deliver(stale);
      expect(await ledgerCount([stale])).toBe(1);
      expect(await subscriptionRow(id)).toMatchObject({ status: 'paused', pausedUntil: until });
      expect(await readSubscription(agent, id)).toMatchObject({ status: 'paused', pausedUntil: until });
    } finally {
      await fake.resumeWebhooks();
    }
  });

  it('a skip and a level change, then stale events: both stand', async () => {
    const { id, stripeSubscriptionId, agent } = await paidSubscription();
    await fake.pauseWebhooks();
    try {
      const stale = await heldUpdateEvent(stripeSubscriptionId, 'before the skip');
      const skipped = await agent.post(`/api/subscriptions/${id}/skip`);
      expect(skipped.status, JSON.stringify(skipped.body)).toBe(200);
      const changed = await agent.patch(`/api/subscriptions/${id}`).send({ roastLevel: 'light', cadenceWeeks: 3 });
      expect(changed.status, JSON.stringify(changed.body)).toBe(200);
      const before = subscriptionDeliveriesResponseSchema.parse((await agent.get(`/api/subscriptions/${id}/deliveries?count=4`)).body).items;
      expect(before.some((delivery) => delivery.status === 'skipped')).toBe(true);

      await deliver(stale);
      await deliver(stale);
      const after = subscriptionDeliveriesResponseSchema.parse((await agent.get(`/api/subscriptions/${id}/deliveries?count=4`)).body).items;
      expect(after).toEqual(before);
      expect(await readSubscription(agent, id)).toMatchObject({ status: 'active', roastLevel: 'light', cadenceWeeks: 3 });
    } finally {
      await fake.resumeWebhooks();
    }
  });

  it('two stale events in reverse order, each twice, around a pause and a level change: the changes stand, every event is recorded once', async () => {
    const { id, stripeSubscriptionId, agent } = await paidSubscription();
    await fake.pauseWebhooks();
    try {
      const earlier = await heldUpdateEvent(stripeSubscriptionId, 'first');
      const later = await heldUpdateEvent(stripeSubscriptionId, 'second');
      const until = pauseUntil();
      expect((await agent.post(`/api/subscriptions/${id}/pause`).send({ until, paidDelivery: 'ship' })).status).toBe(200);
      expect((await agent.patch(`/api/subscriptions/${id}`).send({ roastLevel: 'light' })).status).toBe(200);

      for (const eventId of [later, earlier, later, earlier]) await deliver(eventId);
      expect(await ledgerCount([earlier, later])).toBe(2);
      expect(await subscriptionRow(id)).toMatchObject({ status: 'paused', pausedUntil: until, roastLevel: 'light' });
    } finally {
      await fake.resumeWebhooks();
    }
  });

  it('what the payment service owns still moves: cancelled by it while paused reads cancelled, whatever came before', async () => {
    const { id, stripeSubscriptionId, agent } = await paidSubscription();
    await fake.pauseWebhooks();
    try {
      const stale = await heldUpdateEvent(stripeSubscriptionId, 'before the pause');
      expect((await agent.post(`/api/subscriptions/${id}/pause`).send({ until: pauseUntil(), paidDelivery: 'ship' })).status).toBe(200);
      await stripe.subscriptions.cancel(stripeSubscriptionId);
      const [deleted] = await eventsAbout(stripeSubscriptionId, 'customer.subscription.deleted');
      expect(deleted).toBeDefined();
      // The cancellation first, then the older notice: it reads Stripe's current state, which is cancelled.
      await deliver(deleted!.eventId);
      await deliver(stale);
      const row = await subscriptionRow(id);
      expect(row.status).toBe('cancelled');
      expect(row.cancelledAt).not.toBeNull();
      const [recorded] = await getTestDb().select({ id: paymentEvents.id }).from(paymentEvents).where(eq(paymentEvents.id, deleted!.eventId));
      expect(recorded).toBeDefined();
    } finally {
      await fake.resumeWebhooks();
    }
  });
});
