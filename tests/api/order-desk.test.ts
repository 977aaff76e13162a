import { and, eq, like } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { apiErrorSchema } from '@shared/schemas/errors';
import { orderDetailSchema } from '@shared/schemas/orders';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { auditLog, emailOutbox } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { movementsOf, stockOf } from './checkout-support';
import { outboxRow, waitFor } from './outbox-support';
import { orderRow, startPaymentsServer, type PaymentsServer } from './payments-support';
import { createLotForSale, createOrder, createSubscription, createTestUser, shipTo } from '../factories/index';

const app = createTestApp();
let webhooks: PaymentsServer;
let staffUser: Awaited<ReturnType<typeof createTestUser>>;
let staff: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  webhooks = await startPaymentsServer();
  staffUser = await createTestUser('staff');
  staff = await signedInAgent(app, staffUser);
});
afterAll(async () => {
  await webhooks.stop();
});

async function auditOf(action: string, actorId: string) {
  return getTestDb()
    .select({ detail: auditLog.detail })
    .from(auditLog)
    .where(and(eq(auditLog.action, action), eq(auditLog.actorId, actorId)));
}

/** A green order of one 2 lb bag placed through checkout (908 g held), paid on the fake's page when asked. */
async function checkedOutOrder({ pay }: { pay: boolean }) {
  const lot = await createLotForSale(5_000);
  const customer = await signedInAgent(app, await createTestUser('customer'));
  const placed = await customer.post('/api/checkout/green').send({ items: [{ lotCode: lot.code, size: '2lb', quantity: 1 }], shippingAddress: shipTo });
  expect(placed.status).toBe(201);
  const { orderId, checkoutUrl } = greenCheckoutResponseSchema.parse(placed.body);
  if (pay) {
    expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
    await waitFor(
      () => orderRow(orderId),
      (row) => row.status === 'paid',
      10_000,
      'the payment webhook',
    );
  }
  return { lot, orderId, customer };
}

describe('POST /api/orders/:id/cancel (staff)', () => {
  it('cancels an order awaiting payment, puts its stock back and records who did it', async () => {
    const { lot, orderId } = await checkedOutOrder({ pay: false });
    const response = await staff.post(`/api/orders/${orderId}/cancel`);
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(orderDetailSchema.parse(response.body).status).toBe('cancelled');
    expect(await stockOf(lot.id)).toBe(5_000);
    expect(await movementsOf(lot.id, orderId)).toEqual({ sum: 0, count: 2 });
    expect(await auditOf('order.cancelled', staffUser.id)).toContainEqual({ detail: { orderId } });
  });

  it('answers 409 for a paid order (the owner refunds it) and changes nothing', async () => {
    const { lot, orderId } = await checkedOutOrder({ pay: true });
    const response = await staff.post(`/api/orders/${orderId}/cancel`);
    expect(response.status).toBe(409);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('order_not_cancellable');
    expect((await orderRow(orderId)).status).toBe('paid');
    expect(await stockOf(lot.id)).toBe(5_000 - 908);
  });
});

describe('POST /api/orders/:id/resend/:template (staff)', () => {
  it('queues the order-confirmed e-mail again, as first written, to the customer; one sent never is 409', async () => {
    const { orderId } = await checkedOutOrder({ pay: true });
    const first = await waitFor(
      () => outboxRow(`order-confirmed:${orderId}`),
      (row) => row !== undefined,
      10_000,
      'the order-confirmed e-mail',
    );
    const response = await staff.post(`/api/orders/${orderId}/resend/order-confirmed`);
    expect(response.status, JSON.stringify(response.body)).toBe(202);
    const again = await getTestDb()
      .select()
      .from(emailOutbox)
      .where(like(emailOutbox.dedupeKey, `order-confirmed:${orderId}:resend:%`));
    expect(again).toHaveLength(1);
    expect(again[0]).toMatchObject({ template: 'order-confirmed', toAddress: first!.toAddress, subject: first!.subject, payload: first!.payload });
    expect(await auditOf('order.email_resent', staffUser.id)).toContainEqual({ detail: { orderId, template: 'order-confirmed' } });

    const neverSent = await staff.post(`/api/orders/${orderId}/resend/shipped`);
    expect(neverSent.status).toBe(409);
    expect(apiErrorSchema.parse(neverSent.body).error.code).toBe('email_not_sent');
  });

  it('answers 400 naming the template for one that cannot be resent', async () => {
    const order = await createOrder({ userId: (await createTestUser('customer')).id, status: 'paid', subtotalCents: 1899 });
    const response = await staff.post(`/api/orders/${order.id}/resend/password-reset`);
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('template');
  });
});

describe('PATCH /api/orders/:id/address (staff)', () => {
  const corrected = { name: 'Robin Invented', line1: '12 Corrected Row', line2: 'Back door', city: 'Wrenfield', region: 'CO', postalCode: '81641' };

  it('corrects where a paid order ships before it ships, and records it', async () => {
    const order = await createOrder({ userId: (await createTestUser('customer')).id, status: 'paid', subtotalCents: 1899 });
    const response = await staff.patch(`/api/orders/${order.id}/address`).send(corrected);
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(orderDetailSchema.parse(response.body).shippingAddress).toEqual({ ...corrected, country: 'US' });
    expect(await auditOf('order.address_corrected', staffUser.id)).toContainEqual({ detail: { orderId: order.id } });
  });

  it('answers 400 naming the empty field, and 409 once the order has shipped; neither changes the address', async () => {
    const customer = await createTestUser('customer');
    const paid = await createOrder({ userId: customer.id, status: 'paid', subtotalCents: 1899 });
    const bad = await staff.patch(`/api/orders/${paid.id}/address`).send({ ...corrected, line1: ' ' });
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toHaveProperty('line1');
    expect((await orderRow(paid.id)).shippingAddress.line1).toBe(shipTo.line1);

    const shipped = await createOrder({ userId: customer.id, status: 'shipped', subtotalCents: 1899 });
    const late = await staff.patch(`/api/orders/${shipped.id}/address`).send(corrected);
    expect(late.status).toBe(409);
    expect((await orderRow(shipped.id)).shippingAddress.line1).toBe(shipTo.line1);
  });
});

describe('PUT /api/orders/:id/note (staff)', () => {
  it('keeps a staff note that staff read on the order and the customer never sees; an empty note removes it', async () => {
    const customerUser = await createTestUser('customer');
    const customer = await signedInAgent(app, customerUser);
    const order = await createOrder({ userId: customerUser.id, status: 'paid', subtotalCents: 1899 });

    const saved = await staff.put(`/api/orders/${order.id}/note`).send({ note: '  Leave with the neighbour at no. 6.  ' });
    expect(saved.status).toBe(200);
    expect(orderDetailSchema.parse(saved.body).staffNote).toBe('Leave with the neighbour at no. 6.');
    const seenByCustomer = await customer.get(`/api/orders/${order.id}`);
    expect(seenByCustomer.body).not.toHaveProperty('staffNote');

    const cleared = await staff.put(`/api/orders/${order.id}/note`).send({ note: '' });
    expect(orderDetailSchema.parse(cleared.body).staffNote).toBeNull();
    const tooLong = await staff.put(`/api/orders/${order.id}/note`).send({ note: 'x'.repeat(2001) });
    expect(tooLong.status).toBe(400);
    expect(apiErrorSchema.parse(tooLong.body).error.fields).toHaveProperty('note');
  });
});

describe('staff on a subscriber’s behalf', () => {
  it('staff skip the next delivery and change the grind of a customer’s subscription, each audited with the customer named; another customer still gets 404', async () => {
    const customer = await createTestUser('customer');
    // Deliveries from January 2031, so none is past its cutoff.
    const subscription = await createSubscription({ userId: customer.id, status: 'active', priceCents: 3200, anchorDate: '2031-01-07' });

    const skipped = await staff.post(`/api/subscriptions/${subscription.id}/skip`).send({});
    expect(skipped.status, JSON.stringify(skipped.body)).toBe(200);
    expect(await auditOf('subscription.changed_by_staff', staffUser.id)).toContainEqual({
      detail: { subscriptionId: subscription.id, customerId: customer.id, change: 'skipped' },
    });

    const changed = await staff.patch(`/api/subscriptions/${subscription.id}`).send({ grind: 'pour-over' });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    expect(changed.body.grind).toBe('pour-over');
    expect(await auditOf('subscription.changed_by_staff', staffUser.id)).toContainEqual({
      detail: { subscriptionId: subscription.id, customerId: customer.id, change: 'changed' },
    });

    const stranger = await signedInAgent(app, await createTestUser('customer'));
    expect((await stranger.post(`/api/subscriptions/${subscription.id}/resume`)).status).toBe(404);
  });
});
