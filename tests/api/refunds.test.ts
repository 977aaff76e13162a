import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { apiErrorSchema } from '@shared/schemas/errors';
import { refundResponseSchema } from '@shared/schemas/packing';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { movementsOf, stockOf } from './checkout-support';
import { waitFor } from './outbox-support';
import { orderRow, startPaymentsServer, testStripe, type PaymentsServer } from './payments-support';
import { createGreenOrder, createLotForSale, createTestUser, shipTo } from '../factories/index';

const app = createTestApp();
const stripe = testStripe();
// The fake's webhooks (charge.refunded among them) reach this listening server, which applies them.
let webhooks: PaymentsServer;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let staff: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  webhooks = await startPaymentsServer();
  owner = await signedInAgent(app, await createTestUser('owner'));
  staff = await signedInAgent(app, await createTestUser('staff'));
});

afterAll(async () => {
  await webhooks.stop();
});

/** A green order of 2 × 1 lb bought through checkout and paid on the fake's page: 908 g leave stock. */
async function paidGreenOrder() {
  const lot = await createLotForSale(20_000);
  const customer = await signedInAgent(app, await createTestUser('customer'));
  const checkout = await customer.post('/api/checkout/green').send({ items: [{ lotCode: lot.code, size: '1lb', quantity: 2 }], shippingAddress: shipTo });
  expect(checkout.status, JSON.stringify(checkout.body)).toBe(201);
  const { orderId, checkoutUrl } = greenCheckoutResponseSchema.parse(checkout.body);
  expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
  const order = await waitFor(
    () => orderRow(orderId),
    (row) => row.status === 'paid',
    10_000,
    'the payment webhook',
  );
  return { lot, order };
}

describe('POST /api/orders/:id/refund', () => {
  it('refunds in full through Stripe, answers 202, lets the webhook mark the order refunded and returns the unshipped green stock exactly once', async () => {
    const { lot, order } = await paidGreenOrder();
    // 2 × 454 g fill (1 lb = 453.59237 g, rounded up: NIST SP 811 App. B) left at checkout.
    expect(await stockOf(lot.id)).toBe(20_000 - 908);

    const response = await owner.post(`/api/orders/${order.id}/refund`).send({ reason: 'requested_by_customer' });

    expect(response.status, JSON.stringify(response.body)).toBe(202);
    expect(refundResponseSchema.parse(response.body).requestedCents).toBe(order.totalCents);
    const refunded = await waitFor(
      () => orderRow(order.id),
      (row) => row.status === 'refunded',
      10_000,
      'the charge.refunded webhook',
    );
    expect(refunded.refundedCents).toBe(order.totalCents);
    expect(await stockOf(lot.id)).toBe(20_000);
    expect(await movementsOf(lot.id, order.id)).toEqual({ sum: 0, count: 2 });

    const again = await owner.post(`/api/orders/${order.id}/refund`).send({});

    expect(again.status).toBe(409);
    expect(apiErrorSchema.parse(again.body).error.code).toBe('already_refunded');
    expect(await stockOf(lot.id)).toBe(20_000);
    expect(await movementsOf(lot.id, order.id)).toEqual({ sum: 0, count: 2 });
    const refunds = await stripe.refunds.list({ payment_intent: refunded.stripePaymentIntentId! });
    expect(refunds.data).toHaveLength(1);
  });

  it('makes one partial refund for a request sent twice with the same Idempotency-Key, and keeps the stock', async () => {
    const { lot, order } = await paidGreenOrder();
    const send = () => owner.post(`/api/orders/${order.id}/refund`).set('Idempotency-Key', 'refund-test-0001').send({ amountCents: 500 });

    const first = await send();
    const second = await send();

    expect([first.status, second.status]).toEqual([202, 202]);
    expect(refundResponseSchema.parse(second.body).requestedCents).toBe(500);
    const partly = await waitFor(
      () => orderRow(order.id),
      (row) => row.refundedCents === 500,
      10_000,
      'the charge.refunded webhook',
    );
    expect(partly.status).toBe('paid');
    expect((await stripe.refunds.list({ payment_intent: partly.stripePaymentIntentId! })).data.map((refund) => refund.amount)).toEqual([500]);
    expect(await stockOf(lot.id)).toBe(20_000 - 908);
  });

  it('answers 400 naming amountCents for more than is left to refund, and refunds nothing', async () => {
    const { order } = await paidGreenOrder();

    const response = await owner.post(`/api/orders/${order.id}/refund`).send({ amountCents: order.totalCents + 1 });
    const notWhole = await owner.post(`/api/orders/${order.id}/refund`).send({ amountCents: 10.5 });

    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('amountCents');
    expect(notWhole.status).toBe(400);
    expect(apiErrorSchema.parse(notWhole.body).error.fields).toHaveProperty('amountCents');
    expect((await stripe.refunds.list({ payment_intent: (await orderRow(order.id)).stripePaymentIntentId! })).data).toEqual([]);
  });

  it('answers 409 for an order with no payment', async () => {
    const lot = await createLotForSale(5_000);
    const unpaid = await createGreenOrder((await createTestUser('customer')).id, lot.id, { shipDate: '2041-03-04', status: 'pending_payment' });

    const response = await owner.post(`/api/orders/${unpaid.id}/refund`).send({});

    expect(response.status).toBe(409);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('not_paid');
  });

  it('leaves the stock alone when a green order is refunded after it shipped', async () => {
    const { lot, order } = await paidGreenOrder();
    expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);
    expect((await staff.post(`/api/orders/${order.id}/ship`).send({ carrier: 'Invented Parcel Co', trackingNumber: 'RT123' })).status).toBe(200);

    expect((await owner.post(`/api/orders/${order.id}/refund`).send({})).status).toBe(202);

    await waitFor(
      () => orderRow(order.id),
      (row) => row.status === 'refunded',
      10_000,
      'the charge.refunded webhook',
    );
    expect(await stockOf(lot.id)).toBe(20_000 - 908);
    expect((await movementsOf(lot.id, order.id)).count).toBe(1);
  });
});
