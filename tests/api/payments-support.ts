// Helpers for the payments tests: a real listening server the fake's webhooks reach, the real Stripe
// SDK pointed at the fake, and readers for the rows the payment flow writes.
import { asc, count, eq, inArray } from 'drizzle-orm';
import type Stripe from 'stripe';
import { inject } from 'vitest';
import { stripeFakeControl } from '../../dev-services/stripe-fake/control-client';
import { loadConfig, type Config } from '../../server/config';
import { deliveries, emailOutbox, orders, paymentEvents, subscriptions } from '../../server/db/schema/index';
import { createPaymentsGateway, createStripeClient } from '../../server/integrations/payments';
import { startServer, type RunningServer } from '../../server/index';
import { createLogger } from '../../server/lib/logger';
import { createPaymentsRepo } from '../../server/modules/payments/payments.repo';
import { createPaymentsService } from '../../server/modules/payments/payments.service';
import { getTestDb } from '../setup/test-db';
import { waitFor } from './outbox-support';
import { freePort } from '../setup/free-port';

/**
 * The payment fake's control API. `deliverEvent` sends one event now and, when the shop accepts it
 * (2xx: the event is in the inbox), waits until the shop's job queue has applied it, so a test
 * reads the effect of each event it delivers, in the order it chose.
 */
export const stripeFake = () => {
  const control = stripeFakeControl(inject('stripeFakeUrl'));
  return {
    ...control,
    async deliverEvent(eventId: string) {
      const attempt = await control.deliverEvent(eventId);
      if (attempt.statusCode !== null && attempt.statusCode >= 200 && attempt.statusCode < 300) await eventApplied(eventId);
      return attempt;
    },
  };
};

/** Waits until the shop has applied a received payment event (its inbox row is marked processed). */
export async function eventApplied(eventId: string, timeoutMs = 20_000): Promise<void> {
  await waitFor(
    () => getTestDb().select({ processedAt: paymentEvents.processedAt }).from(paymentEvents).where(eq(paymentEvents.id, eventId)),
    (rows) => rows[0]?.processedAt != null,
    timeoutMs,
    `payment event ${eventId} to be applied`,
  );
}

/** The settings a test server runs with: test database, test mail catcher, the tests' payment fake. */
export function paymentsTestConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    STATIC_DIR: 'dist',
    DATABASE_URL: inject('databaseUrl'),
    SMTP_URL: inject('smtpUrl'),
    STRIPE_API_URL: inject('stripeFakeUrl'),
    STRIPE_WEBHOOK_SECRET: inject('stripeWebhookSecret'),
    ...overrides,
  });
}

export interface PaymentsServer {
  server: RunningServer;
  config: Config;
  stop(): Promise<void>;
}

/** The whole server (queue, outbox relay) listening on a free port, with the fake's webhooks pointed at it. */
export async function startPaymentsServer(): Promise<PaymentsServer> {
  const config = paymentsTestConfig({ PORT: String(await freePort()) });
  const server = await startServer(config, createLogger(config));
  await stripeFake().setWebhookEndpoint(`${server.url}/api/payments/webhook`);
  return {
    server,
    config,
    async stop() {
      await stripeFake().setWebhookEndpoint(null);
      await server.stop();
    },
  };
}

/** The real Stripe SDK, talking to the tests' fake as Restday does. */
export function testStripe(): Stripe {
  return createStripeClient(paymentsTestConfig());
}

/** The payments service as the server's own routes would build it (its return URLs point at `config`'s server). */
export function testPaymentsService(config: Config) {
  return createPaymentsService({ repo: createPaymentsRepo(getTestDb()), gateway: createPaymentsGateway(config), config });
}

export async function orderRow(orderId: string) {
  const [row] = await getTestDb().select().from(orders).where(eq(orders.id, orderId));
  return row!;
}

export async function subscriptionRow(subscriptionId: string) {
  const [row] = await getTestDb().select().from(subscriptions).where(eq(subscriptions.id, subscriptionId));
  return row!;
}

/** A subscription's delivery rows by roast date. */
export async function deliveryRows(subscriptionId: string) {
  return getTestDb().select().from(deliveries).where(eq(deliveries.subscriptionId, subscriptionId)).orderBy(asc(deliveries.roastDate));
}

/** A subscription's delivery orders, oldest first. */
export async function subscriptionOrders(subscriptionId: string) {
  return getTestDb().select().from(orders).where(eq(orders.subscriptionId, subscriptionId)).orderBy(asc(orders.createdAt));
}

export async function orderCount(userId: string) {
  const [row] = await getTestDb().select({ n: count() }).from(orders).where(eq(orders.userId, userId));
  return row!.n;
}

export async function ledgerCount(eventIds: string[]) {
  if (eventIds.length === 0) return 0;
  const [row] = await getTestDb().select({ n: count() }).from(paymentEvents).where(inArray(paymentEvents.id, eventIds));
  return row!.n;
}

export async function outboxCount(dedupeKey: string) {
  const [row] = await getTestDb().select({ n: count() }).from(emailOutbox).where(eq(emailOutbox.dedupeKey, dedupeKey));
  return row!.n;
}

/** The fake's events about one Stripe object (a session, a charge, an invoice, a subscription). */
export async function eventsAbout(objectId: string, type?: Parameters<ReturnType<typeof stripeFake>['deliveries']>[0]) {
  return (await stripeFake().deliveries(type)).filter((delivery) => delivery.objectId === objectId);
}

/** Lets in-flight deliveries and the relay finish, so "nothing more arrived" means something. */
export const settle = (ms = 1500) => new Promise((resolve) => setTimeout(resolve, ms));
