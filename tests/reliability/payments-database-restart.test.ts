import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { startCluster, testClusterOptions } from '../../dev-services/postgres';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { inboxOf, waitFor } from '../api/outbox-support';
import {
  eventsAbout,
  ledgerCount,
  orderRow,
  outboxCount,
  settle,
  startPaymentsServer,
  stripeFake,
  testPaymentsService,
  type PaymentsServer,
} from '../api/payments-support';
import { createCustomer, createGreenOrder, createLotForSale } from '../factories/index';

// Stops the real test cluster mid-run, so this file restarts it (on the same port) whatever happens.
const { port } = startCluster(testClusterOptions());
const restartCluster = () => startCluster({ ...testClusterOptions(), port });

let running: PaymentsServer;
const fake = stripeFake();

beforeAll(async () => {
  running = await startPaymentsServer();
});

afterAll(async () => {
  restartCluster();
  await running.stop();
});

async function payableOrders(count: number, lotId: string) {
  const payments = testPaymentsService(running.config);
  return Promise.all(
    Array.from({ length: count }, async (_, index) => {
      const customer = await createCustomer(`outage-${index}`);
      const order = await createGreenOrder(customer.id, lotId);
      return { customer, order, ...(await payments.createCheckoutForOrder(order.id)) };
    }),
  );
}

describe('when PostgreSQL restarts while payment webhooks arrive', () => {
  it("the fake's retries land once it is back: the server was never restarted, and no event is lost or applied twice", async () => {
    const lot = await createLotForSale(50_000);
    const orders = await payableOrders(6, lot.id);
    const [before, during] = [orders.slice(0, 2), orders.slice(2)];

    for (const { checkoutUrl } of before) expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
    restartCluster().stop();

    // Paid while the database is down: each webhook is answered with an error and retried.
    for (const { checkoutUrl } of during) expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
    const refused = await waitFor(
      async () => Promise.all(during.map(({ checkoutSessionId }) => eventsAbout(checkoutSessionId, 'checkout.session.completed'))),
      (found) => found.every((events) => events[0] && events[0].attempts.length >= 2),
      10_000,
      'failed deliveries to be retried',
    );
    for (const [delivery] of refused) {
      expect(delivery!.status).toBe('pending');
      expect(delivery!.attempts.every((attempt) => attempt.statusCode === 503)).toBe(true);
    }
    expect((await fetch(`${running.server.url}/api/health`)).status).toBe(503);

    restartCluster();

    for (const { order } of orders) {
      await waitFor(
        () => orderRow(order.id),
        (row) => row.status === 'paid',
        20_000,
        `order ${order.id} to be paid`,
      );
    }
    const completed = await Promise.all(orders.map(({ checkoutSessionId }) => eventsAbout(checkoutSessionId, 'checkout.session.completed')));
    expect(completed.map((events) => events.map((event) => event.status))).toEqual(orders.map(() => ['delivered']));
    const eventIds = completed.map((events) => events[0]!.eventId);
    expect(await ledgerCount(eventIds)).toBe(orders.length);

    // Sent once more after recovery, every event is recognised as already applied.
    for (const eventId of eventIds) expect((await fake.deliverEvent(eventId)).statusCode).toBe(200);
    expect(await ledgerCount(eventIds)).toBe(orders.length);
    for (const { order, customer } of orders) {
      expect(await outboxCount(`order-confirmed:${order.id}`)).toBe(1);
      await waitFor(
        () => inboxOf(inject('mailCatcherUrl'), customer.email),
        (mails) => mails.length > 0,
        20_000,
        `the e-mail to ${customer.email}`,
      );
    }
    await settle();
    for (const { customer } of orders) expect(await inboxOf(inject('mailCatcherUrl'), customer.email)).toHaveLength(1);

    // The server that answered 503 during the outage, never restarted, is healthy again.
    expect((await fetch(`${running.server.url}/api/health`)).status).toBe(200);
  });
});
