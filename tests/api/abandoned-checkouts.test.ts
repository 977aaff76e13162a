import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkoutUrlResponseSchema, greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { apiErrorSchema } from '@shared/schemas/errors';
import { orderListResponseSchema } from '@shared/schemas/orders';
import { subscriptionCheckoutResponseSchema } from '@shared/schemas/subscriptions';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { movementsOf, stockOf } from './checkout-support';
import { waitFor } from './outbox-support';
import { orderRow, startPaymentsServer, subscriptionRow, type PaymentsServer } from './payments-support';
import { createLotForSale, createTestUser, rotationCheckoutRequest, shipTo } from '../factories/index';

const app = createTestApp();

async function placeUnpaidOrder(lotCode: string) {
  const agent = await signedInAgent(app, await createTestUser('customer'));
  const placed = await agent.post('/api/checkout/green').send({ items: [{ lotCode, size: '2lb', quantity: 1 }], shippingAddress: shipTo });
  expect(placed.status).toBe(201);
  return { agent, ...greenCheckoutResponseSchema.parse(placed.body) };
}

describe('POST /api/orders/:id/pay — Pay now on an order left awaiting payment', () => {
  let running: PaymentsServer;
  beforeAll(async () => {
    running = await startPaymentsServer();
  });
  afterAll(async () => {
    await running.stop();
  });

  it('answers the same payment page for the same order, reserves nothing again, and paying it marks that order paid', async () => {
    const lot = await createLotForSale(5_000);
    const { agent, orderId, checkoutUrl } = await placeUnpaidOrder(lot.code);

    const resumed = await agent.post(`/api/orders/${orderId}/pay`);
    expect(resumed.status).toBe(200);
    expect(checkoutUrlResponseSchema.parse(resumed.body).checkoutUrl).toBe(checkoutUrl);
    // A 2 lb bag is filled to 908 g (2 × 453.59237 g, NIST SP 811 App. B, rounded up): taken once.
    expect(await stockOf(lot.id)).toBe(5_000 - 908);
    expect(await movementsOf(lot.id, orderId)).toEqual({ sum: -908, count: 1 });

    expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
    await waitFor(
      () => orderRow(orderId),
      (row) => row.status === 'paid',
      10_000,
      'the order to be paid',
    );
    const again = await agent.post(`/api/orders/${orderId}/pay`);
    expect(again.status).toBe(409);
    expect(apiErrorSchema.parse(again.body).error.code).toBe('order_not_payable');
  });

  it("answers 404 for another customer's order and changes nothing", async () => {
    const lot = await createLotForSale(5_000);
    const { orderId } = await placeUnpaidOrder(lot.code);
    const stranger = await signedInAgent(app, await createTestUser('customer'));
    expect((await stranger.post(`/api/orders/${orderId}/pay`)).status).toBe(404);
    expect((await stranger.post(`/api/orders/${orderId}/discard`)).status).toBe(404);
    expect((await orderRow(orderId)).status).toBe('pending_payment');
  });
});

describe('POST /api/orders/:id/discard', () => {
  it('cancels the unpaid order, puts its stock back, and leaves it out of the customer’s history (staff still see it)', async () => {
    const lot = await createLotForSale(5_000);
    const { agent, orderId } = await placeUnpaidOrder(lot.code);

    expect((await agent.post(`/api/orders/${orderId}/discard`)).status).toBe(204);
    const row = await orderRow(orderId);
    expect(row.status).toBe('cancelled');
    expect(row.discardedAt).toBeInstanceOf(Date);
    expect(await stockOf(lot.id)).toBe(5_000);
    expect(await movementsOf(lot.id, orderId)).toEqual({ sum: 0, count: 2 });

    const history = orderListResponseSchema.parse((await agent.get('/api/orders')).body);
    expect(history.items.map((order) => order.id)).not.toContain(orderId);
    const staff = await signedInAgent(app, await createTestUser('staff'));
    expect((await staff.get(`/api/orders/${orderId}`)).body.status).toBe('cancelled');

    const twice = await agent.post(`/api/orders/${orderId}/discard`);
    expect(twice.status).toBe(409);
    expect(await stockOf(lot.id)).toBe(5_000);
  });
});

describe('POST /api/subscriptions/:id/pay and /discard — a subscription whose first payment never came', () => {
  async function startUnpaidSubscription() {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const started = await agent.post('/api/checkout/subscription').send(rotationCheckoutRequest);
    expect(started.status).toBe(201);
    return { agent, ...subscriptionCheckoutResponseSchema.parse(started.body) };
  }

  it('Pay now answers the same payment page for the same subscription', async () => {
    const { agent, subscriptionId, checkoutUrl } = await startUnpaidSubscription();
    const resumed = await agent.post(`/api/subscriptions/${subscriptionId}/pay`);
    expect(resumed.status).toBe(200);
    expect(checkoutUrlResponseSchema.parse(resumed.body).checkoutUrl).toBe(checkoutUrl);
    expect((await subscriptionRow(subscriptionId)).status).toBe('incomplete');
  });

  it('Discard cancels it and leaves it out of the customer’s subscriptions; a started one answers 409', async () => {
    const { agent, subscriptionId } = await startUnpaidSubscription();
    expect((await agent.post(`/api/subscriptions/${subscriptionId}/discard`)).status).toBe(204);
    expect((await subscriptionRow(subscriptionId)).status).toBe('cancelled');
    expect((await agent.get('/api/subscriptions')).body.items).toEqual([]);
    expect((await agent.post(`/api/subscriptions/${subscriptionId}/pay`)).status).toBe(409);
  });
});
