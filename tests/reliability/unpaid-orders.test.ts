// A checkout whose order committed but whose payment page was never saved (the database went away
// between the two): the unpaid-orders sweep puts its stock back once, and a retry of the same
// checkout pays the same order. The fault is real: the test cluster is stopped the moment the
// payment fake has answered the session request, before the answer reaches the server.
import { randomUUID } from 'node:crypto';
import { desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { apiErrorSchema } from '@shared/schemas/errors';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { startCluster, testClusterOptions } from '../../dev-services/postgres';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { orders } from '../../server/db/schema/index';
import { createPaymentsGateway } from '../../server/integrations/payments';
import { createAdjustableClock, systemClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { createUnpaidOrdersRepo } from '../../server/modules/checkout/unpaid-orders.repo';
import { createUnpaidOrdersService } from '../../server/modules/checkout/unpaid-orders.service';
import { waitFor } from '../api/outbox-support';
import { movementsOf, stockOf } from '../api/checkout-support';
import { paymentsTestConfig, startPaymentsServer, testPaymentsService, type PaymentsServer } from '../api/payments-support';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { startStripeRelay, type StripeRelay } from './stripe-relay';
import { createCustomer, createGreenOrder, createLotForSale, createTestUser, shipTo } from '../factories/index';

// Stops the real test cluster mid-run, so this file restarts it (on the same port) whatever happens.
const { port } = startCluster(testClusterOptions());
const restartCluster = () => startCluster({ ...testClusterOptions(), port });

const graceMinutes = 5;
const oneLbFillGrams = 454; // 1 lb = 453.59237 g, filled to the next whole gram so a bag never weighs short
let relay: StripeRelay;
let running: PaymentsServer;

beforeAll(async () => {
  relay = await startStripeRelay(inject('stripeFakeUrl'));
  running = await startPaymentsServer();
});

afterAll(async () => {
  restartCluster();
  await running.stop();
  await relay.close();
});

/** The sweep as the job runs it, with real time set `minutesAhead` from now. */
function sweepAt(minutesAhead: number) {
  const realClock = createAdjustableClock();
  realClock.set(new Date(Date.now() + minutesAhead * 60_000));
  return createUnpaidOrdersService({
    repo: createUnpaidOrdersRepo(getTestDb()),
    gateway: createPaymentsGateway(paymentsTestConfig()),
    clock: systemClock,
    realClock,
    logger: createLogger(paymentsTestConfig()),
    graceMinutes,
    pageMinutes: 60,
  });
}

/** A buyer's checkout of 2 × 1 lb whose database stops once Stripe has made the session; the session's id. */
async function checkoutThatLosesItsPage() {
  const lot = await createLotForSale(10 * oneLbFillGrams);
  const buyer = await createTestUser('customer');
  const agent = await signedInAgent(createTestApp({ env: { STRIPE_API_URL: relay.url } }), buyer);
  const checkoutKey = randomUUID();
  let madeSessionId = '';
  relay.afterNextAnswer(
    (method, path) => method === 'POST' && path.startsWith('/v1/checkout/sessions'),
    (answer) => {
      madeSessionId = (JSON.parse(answer.toString('utf8')) as { id: string }).id;
      restartCluster().stop();
    },
  );
  const body = { items: [{ lotCode: lot.code, size: '1lb', quantity: 2 }], shippingAddress: shipTo };
  const failed = await agent.post('/api/checkout/green').set('Idempotency-Key', checkoutKey).send(body);
  restartCluster();
  expect(failed.status).toBe(503);
  expect(apiErrorSchema.parse(failed.body).error.code).toBe('database_unavailable');
  expect(madeSessionId).toMatch(/^cs_test_/);

  const [order] = await getTestDb().select().from(orders).where(eq(orders.userId, buyer.id)).orderBy(desc(orders.createdAt));
  // The order and its reservation committed; its page did not, and neither did the cancel.
  expect(order).toMatchObject({ status: 'pending_payment', stripeCheckoutSessionId: null });
  expect(await stockOf(lot.id)).toBe(8 * oneLbFillGrams);
  return { lot, order: order!, agent, checkoutKey, body, madeSessionId };
}

describe('an order whose payment page was lost between commit and save', () => {
  it('is left alone within the grace period, then cancelled with its stock back exactly once however many sweeps run', { timeout: 60_000 }, async () => {
    const { lot, order } = await checkoutThatLosesItsPage();

    await sweepAt(0).reconcile();
    expect((await getTestDb().select().from(orders).where(eq(orders.id, order.id)))[0]).toMatchObject({ status: 'pending_payment' });

    // Past the grace period, two workers sweep at once and a third after them.
    await Promise.all([sweepAt(graceMinutes + 1).reconcile(), sweepAt(graceMinutes + 1).reconcile()]);
    await sweepAt(graceMinutes + 1).reconcile();
    const [cancelled] = await getTestDb().select().from(orders).where(eq(orders.id, order.id));
    expect(cancelled).toMatchObject({ status: 'cancelled' });
    // 10 bags' worth in, 2 reserved and 2 put back: all 4,540 g again; one reservation and one release.
    expect(await stockOf(lot.id)).toBe(10 * oneLbFillGrams);
    expect(await movementsOf(lot.id, order.id)).toEqual({ sum: 0, count: 2 });
  });

  it('a retry of the same checkout gets the same order and the same page, reserves nothing again, and pays that order', { timeout: 60_000 }, async () => {
    const { lot, order, agent, checkoutKey, body, madeSessionId } = await checkoutThatLosesItsPage();

    const retried = await agent.post('/api/checkout/green').set('Idempotency-Key', checkoutKey).send(body);
    expect(retried.status).toBe(201);
    const { orderId, checkoutUrl } = greenCheckoutResponseSchema.parse(retried.body);
    expect(orderId).toBe(order.id);
    expect((await getTestDb().select().from(orders).where(eq(orders.id, order.id)))[0]).toMatchObject({ stripeCheckoutSessionId: madeSessionId });
    expect(await stockOf(lot.id)).toBe(8 * oneLbFillGrams);
    expect(await movementsOf(lot.id)).toEqual({ sum: -2 * oneLbFillGrams, count: 1 });

    expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
    await waitFor(
      async () => (await getTestDb().select({ status: orders.status }).from(orders).where(eq(orders.id, order.id)))[0]!.status,
      (status) => status === 'paid',
      10_000,
      'the order paid',
    );
    // A sweep after the grace period finds nothing to undo.
    await sweepAt(graceMinutes + 1).reconcile();
    expect((await getTestDb().select().from(orders).where(eq(orders.id, order.id)))[0]).toMatchObject({ status: 'paid' });
    expect(await stockOf(lot.id)).toBe(8 * oneLbFillGrams);
  });

  it('past the page’s lifetime, an order whose page Stripe does not know is cancelled; one whose page Stripe still has open is left alone', async () => {
    const lot = await createLotForSale(50_000);
    const unknown = await createGreenOrder((await createCustomer('unknown-page')).id, lot.id);
    await getTestDb()
      .update(orders)
      .set({ stripeCheckoutSessionId: `cs_test_never_made_${randomUUID().slice(0, 8)}` })
      .where(eq(orders.id, unknown.id));
    const open = await createGreenOrder((await createCustomer('open-page')).id, lot.id);
    await testPaymentsService(running.config).createCheckoutForOrder(open.id);

    // 60-minute pages plus the 5-minute grace have passed by the sweep's clock; Stripe's own clock has not moved.
    await sweepAt(60 + graceMinutes + 1).reconcile();
    expect((await getTestDb().select({ status: orders.status }).from(orders).where(eq(orders.id, unknown.id)))[0]).toEqual({ status: 'cancelled' });
    expect((await getTestDb().select({ status: orders.status }).from(orders).where(eq(orders.id, open.id)))[0]).toEqual({ status: 'pending_payment' });
  });
});
