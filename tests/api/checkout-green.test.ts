import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { addressListResponseSchema } from '@shared/schemas/account';
import { greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { apiErrorSchema } from '@shared/schemas/errors';
import { orderItems, orders } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { movementsOf, stockOf } from './checkout-support';
import { waitFor } from './outbox-support';
import { orderRow, startPaymentsServer, testStripe, type PaymentsServer } from './payments-support';
import { createLotForSale, createTestUser, shipTo } from '../factories/index';

const app = createTestApp();
const stripe = testStripe();

async function ordersOf(userId: string) {
  const [row] = await getTestDb().select({ n: count() }).from(orders).where(eq(orders.userId, userId));
  return row!.n;
}

describe('POST /api/checkout/green', () => {
  it('prices the cart with the trade engine, reserves the stock and answers 201 {orderId, checkoutUrl} on the payment fake', async () => {
    const lot = await createLotForSale(10_000);
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const response = await agent.post('/api/checkout/green').send({
      items: [
        { lotCode: lot.code, size: '1lb', quantity: 2 },
        { lotCode: lot.code, size: '8oz', quantity: 1 },
      ],
      shippingAddress: shipTo,
    });
    expect(response.status).toBe(201);
    const { orderId, checkoutUrl } = greenCheckoutResponseSchema.parse(response.body);
    expect(checkoutUrl.startsWith(`${inject('stripeFakeUrl')}/test-payment/`)).toBe(true);

    // $40.00/kg on the declared weight: 1 lb = 453.59237 g → $18.14, 8 oz → $9.07 (pricing.ts rounds once).
    // 2 × (454 + 20 g bag) + (227 + 20) + 180 g box = 1,375 g → the ≤ 2 kg band, $11.95 (Restday default bands).
    const row = await orderRow(orderId);
    expect(row).toMatchObject({ userId: customer.id, kind: 'green', status: 'pending_payment', subtotalCents: 4535, shippingCents: 1195, totalCents: 5730 });
    expect(row.shippingAddress).toMatchObject({ ...shipTo, country: 'US' });
    const lines = await getTestDb().select().from(orderItems).where(eq(orderItems.orderId, orderId));
    expect(lines.map((line) => [line.size, line.quantity, line.fillGrams, line.unitPriceCents]).sort()).toEqual([
      ['1lb', 2, 454, 1814],
      ['8oz', 1, 227, 907],
    ]);

    // 2 × 454 g + 227 g of fill leave the lot at once, recorded as one 'sale' movement.
    expect(await stockOf(lot.id)).toBe(10_000 - 1135);
    expect(await movementsOf(lot.id, orderId)).toEqual({ sum: -1135, count: 1 });
    const session = await stripe.checkout.sessions.retrieve(row.stripeCheckoutSessionId!);
    expect(session.amount_total).toBe(5730);
  });

  it('answers 409 insufficient_stock when a lot cannot cover the cart, and changes nothing', async () => {
    const plenty = await createLotForSale(50_000);
    const scarce = await createLotForSale(900);
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const response = await agent.post('/api/checkout/green').send({
      items: [
        { lotCode: plenty.code, size: '5lb', quantity: 1 },
        { lotCode: scarce.code, size: '1lb', quantity: 2 },
      ],
      shippingAddress: shipTo,
    });
    expect(response.status).toBe(409);
    const { error } = apiErrorSchema.parse(response.body);
    expect(error.code).toBe('insufficient_stock');
    expect(error.message).toContain(scarce.code);
    expect(error.message).toContain('Nothing was reserved or charged');
    // 1 lb bags are filled to 454 g (1 lb rounded up to a whole gram), so 900 g fills one of them.
    expect(error.fields).toEqual({ 'items.1.quantity': 'Only 900 g in stock, enough for 1 bag of this size.' });

    expect(await stockOf(plenty.id)).toBe(50_000);
    expect(await stockOf(scarce.id)).toBe(900);
    expect(await movementsOf(plenty.id)).toEqual({ sum: 0, count: 0 });
    expect(await movementsOf(scarce.id)).toEqual({ sum: 0, count: 0 });
    expect(await ordersOf(customer.id)).toBe(0);
  });

  it('answers 409 with a reason on the quantity of every line whose lot is short, and takes nothing from any lot', async () => {
    const plenty = await createLotForSale(50_000);
    const scarce = await createLotForSale(1_000);
    const nearlyGone = await createLotForSale(200);
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const response = await agent.post('/api/checkout/green').send({
      items: [
        { lotCode: plenty.code, size: '1lb', quantity: 2 },
        { lotCode: scarce.code, size: '8oz', quantity: 3 },
        { lotCode: scarce.code, size: '2lb', quantity: 1 },
        { lotCode: nearlyGone.code, size: '8oz', quantity: 1 },
      ],
      shippingAddress: shipTo,
    });
    expect(response.status).toBe(409);
    const { error } = apiErrorSchema.parse(response.body);
    expect(error.code).toBe('insufficient_stock');
    // Fill weights 8 oz → 227 g, 2 lb → 908 g (rounded up to a whole gram): 1,000 g fills 4 small bags or 1 large one; 200 g fills none.
    expect(error.fields).toEqual({
      'items.1.quantity': 'Only 1,000 g in stock, enough for 4 bags of this size.',
      'items.2.quantity': 'Only 1,000 g in stock, enough for 1 bag of this size.',
      'items.3.quantity': 'Only 200 g in stock, not enough for one bag of this size.',
    });
    expect(error.message).toContain(scarce.code);
    expect(error.message).toContain(nearlyGone.code);

    expect(await stockOf(plenty.id)).toBe(50_000);
    expect(await stockOf(scarce.id)).toBe(1_000);
    expect(await stockOf(nearlyGone.id)).toBe(200);
    expect(await movementsOf(plenty.id)).toEqual({ sum: 0, count: 0 });
    expect(await ordersOf(customer.id)).toBe(0);
  });

  it('answers 400 naming each invalid field, and places nothing', async () => {
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const response = await agent.post('/api/checkout/green').send({
      items: [{ lotCode: '', size: '12oz', quantity: 0 }],
      shippingAddress: { ...shipTo, postalCode: '  ', country: 'United States' },
    });
    expect(response.status).toBe(400);
    const { fields } = apiErrorSchema.parse(response.body).error;
    expect(Object.keys(fields ?? {}).sort()).toEqual(
      ['items.0.lotCode', 'items.0.quantity', 'items.0.size', 'shippingAddress.country', 'shippingAddress.postalCode'].sort(),
    );

    const empty = await agent.post('/api/checkout/green').send({ items: [], shippingAddress: shipTo });
    expect(empty.status).toBe(400);
    expect(apiErrorSchema.parse(empty.body).error.fields).toHaveProperty('items');
    expect(await ordersOf(customer.id)).toBe(0);
  });

  it('answers 400 naming the line whose lot is not for sale, and 400 for the same lot and size twice', async () => {
    const lot = await createLotForSale(10_000);
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const unknown = await agent.post('/api/checkout/green').send({
      items: [
        { lotCode: lot.code, size: '1lb', quantity: 1 },
        { lotCode: 'NO-SUCH-LOT', size: '1lb', quantity: 1 },
      ],
      shippingAddress: shipTo,
    });
    expect(unknown.status).toBe(400);
    expect(apiErrorSchema.parse(unknown.body).error.fields).toEqual({ 'items.1.lotCode': 'There is no lot NO-SUCH-LOT for sale.' });

    const twice = await agent.post('/api/checkout/green').send({
      items: [
        { lotCode: lot.code, size: '1lb', quantity: 1 },
        { lotCode: lot.code, size: '1lb', quantity: 2 },
      ],
      shippingAddress: shipTo,
    });
    expect(twice.status).toBe(400);
    expect(apiErrorSchema.parse(twice.body).error.fields).toHaveProperty('items');
    expect(await stockOf(lot.id)).toBe(10_000);
  });
});

describe('POST /api/checkout/green — save for next time', () => {
  async function addressBookOf(agent: Awaited<ReturnType<typeof signedInAgent>>) {
    const response = await agent.get('/api/account/addresses');
    expect(response.status).toBe(200);
    return addressListResponseSchema.parse(response.body).items;
  }

  it('keeps the shipping address in the address book as the default, once however often it is used again', async () => {
    const lot = await createLotForSale(10_000);
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const order = { items: [{ lotCode: lot.code, size: '8oz', quantity: 1 }], shippingAddress: shipTo, saveAddress: true };

    expect((await agent.post('/api/checkout/green').send(order)).status).toBe(201);
    expect(await addressBookOf(agent)).toEqual([expect.objectContaining({ ...shipTo, line2: null, country: 'US', isDefault: true })]);

    expect((await agent.post('/api/checkout/green').send(order)).status).toBe(201);
    const elsewhere = { ...shipTo, line1: '9 Heron Close' };
    expect((await agent.post('/api/checkout/green').send({ ...order, shippingAddress: elsewhere })).status).toBe(201);
    const book = await addressBookOf(agent);
    expect(book.map((address) => [address.line1, address.isDefault])).toEqual([
      [shipTo.line1, true],
      ['9 Heron Close', false],
    ]);
  });

  it('keeps nothing when the customer leaves it unticked, and answers 400 naming saveAddress for a value that is not true or false', async () => {
    const lot = await createLotForSale(10_000);
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const order = { items: [{ lotCode: lot.code, size: '8oz', quantity: 1 }], shippingAddress: shipTo };

    expect((await agent.post('/api/checkout/green').send({ ...order, saveAddress: false })).status).toBe(201);
    const refused = await agent.post('/api/checkout/green').send({ ...order, saveAddress: 'yes' });
    expect(refused.status).toBe(400);
    expect(apiErrorSchema.parse(refused.body).error.fields).toHaveProperty('saveAddress');
    expect(await ordersOf(customer.id)).toBe(1);
    expect(await addressBookOf(agent)).toEqual([]);
  });
});

describe('after checkout, on the payment fake', () => {
  let running: PaymentsServer;
  beforeAll(async () => {
    running = await startPaymentsServer();
  });
  afterAll(async () => {
    await running.stop();
  });

  it('the expiry webhook cancels the unpaid order and puts its stock back with a movement', async () => {
    const lot = await createLotForSale(5_000);
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const response = await agent.post('/api/checkout/green').send({ items: [{ lotCode: lot.code, size: '2lb', quantity: 2 }], shippingAddress: shipTo });
    expect(response.status).toBe(201);
    const { orderId } = greenCheckoutResponseSchema.parse(response.body);
    expect(await stockOf(lot.id)).toBe(5_000 - 1816);

    await stripe.checkout.sessions.expire((await orderRow(orderId)).stripeCheckoutSessionId!);
    const cancelled = await waitFor(
      () => orderRow(orderId),
      (row) => row.status === 'cancelled',
      10_000,
      'the order to be cancelled',
    );
    expect(cancelled.cancelledAt).toBeInstanceOf(Date);
    expect(await stockOf(lot.id)).toBe(5_000);
    expect(await movementsOf(lot.id, orderId)).toEqual({ sum: 0, count: 2 });
  });

  it('paying keeps the stock taken: the webhook marks the order paid and no movement is added', async () => {
    const lot = await createLotForSale(5_000);
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const response = await agent.post('/api/checkout/green').send({ items: [{ lotCode: lot.code, size: '5lb', quantity: 1 }], shippingAddress: shipTo });
    expect(response.status).toBe(201);
    const { orderId, checkoutUrl } = greenCheckoutResponseSchema.parse(response.body);

    expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
    await waitFor(
      () => orderRow(orderId),
      (row) => row.status === 'paid',
      10_000,
      'the order to be paid',
    );
    expect(await stockOf(lot.id)).toBe(5_000 - 2268);
    expect(await movementsOf(lot.id, orderId)).toEqual({ sum: -2268, count: 1 });
  });
});
