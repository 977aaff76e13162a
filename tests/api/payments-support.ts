// Helpers for the payments tests: a real listening server the fake's webhooks reach, the real Stripe
// SDK pointed at the fake, and invented customers, lots, orders and subscriptions written directly.
import { randomUUID } from 'node:crypto';
import { asc, count, eq, inArray } from 'drizzle-orm';
import type Stripe from 'stripe';
import { inject } from 'vitest';
import { stripeFakeControl } from '../../dev-services/stripe-fake/control-client';
import { loadConfig, type Config } from '../../server/config';
import { deliveries, emailOutbox, lots, orderItems, orders, paymentEvents, subscriptions, users } from '../../server/db/schema/index';
import { createPaymentsGateway, createStripeClient } from '../../server/integrations/payments';
import { startServer, type RunningServer } from '../../server/index';
import { createLogger } from '../../server/lib/logger';
import { createPaymentsRepo } from '../../server/modules/payments/payments.repo';
import { createPaymentsService } from '../../server/modules/payments/payments.service';
import { getTestDb } from '../setup/test-db';
import { testAddress, waitFor } from './outbox-support';
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

/** An invented customer (accounts come in a later step, so the row is written directly). */
export async function createCustomer(tag: string) {
  const email = testAddress(tag);
  const [user] = await getTestDb()
    .insert(users)
    .values({ email, name: 'Robin Testroaster', passwordHash: 'not-a-password-hash' })
    .returning({ id: users.id, email: users.email });
  return user!;
}

const invented = { name: 'Robin Testroaster', line1: '1 Invented Lane', city: 'Sampleville', region: 'CO', postalCode: '80000', country: 'US' };

export async function createTestLot() {
  const code = `PAY-${randomUUID().slice(0, 8).toUpperCase()}`;
  const [lot] = await getTestDb()
    .insert(lots)
    .values({
      code,
      name: `Invented Ridge ${code}`,
      origin: 'Testland',
      region: 'North Ridge',
      producer: 'Invented Growers Cooperative',
      variety: 'Bourbon',
      process: 'washed',
      altitudeM: 1700,
      cropYear: 2026,
      moisturePct: 10.8,
      suggestedLevel: 'medium',
      allowedLevels: ['light', 'medium'],
      stockGrams: 50_000,
      pricePerKgCents: 4000,
    })
    .returning({ id: lots.id, name: lots.name, code: lots.code });
  return lot!;
}

/** A green order waiting for payment: 1 × 1 lb at $18.99 and 2 × 8 oz at $10.50, plus $8.50 shipping = $48.49. */
export async function createGreenOrder(userId: string, lotId: string) {
  const db = getTestDb();
  const [order] = await db
    .insert(orders)
    .values({ userId, kind: 'green', subtotalCents: 3999, shippingCents: 850, totalCents: 4849, shippingAddress: invented })
    .returning({ id: orders.id, totalCents: orders.totalCents });
  await db.insert(orderItems).values([
    { orderId: order!.id, lotId, kind: 'green', size: '1lb', quantity: 1, fillGrams: 454, unitPriceCents: 1899, lineTotalCents: 1899 },
    { orderId: order!.id, lotId, kind: 'green', size: '8oz', quantity: 2, fillGrams: 227, unitPriceCents: 1050, lineTotalCents: 2100 },
  ]);
  return order!;
}

/** A subscription not started yet (2 × 12 oz, $36.00 every two weeks); its deliveries come with its first payment. */
export async function createPendingSubscription(userId: string, lotId: string | null) {
  const [subscription] = await getTestDb()
    .insert(subscriptions)
    .values({ userId, lotId, roastLevel: 'medium', bagSize: '12oz', bagsPerDelivery: 2, cadenceWeeks: 2, priceCents: 3600, shippingAddress: invented })
    .returning({ id: subscriptions.id });
  return { id: subscription!.id };
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
