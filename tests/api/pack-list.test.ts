import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { packListResponseSchema, packOrderSchema } from '@shared/schemas/packing';
import { bagAllocations, deliveries, orderItems } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { inboxOf, outboxRows, testRelay, waitFor } from './outbox-support';
import { allocationsOf, orderStatusOf } from './packing-support';
import {
  createDelivery,
  createGreenOrder,
  createLotForSale,
  createRoastedOrder,
  createSubscription,
  createCustomer,
  createTestUser,
  pickRotationLot,
  recordBatch,
  saveTestShopSettings,
  type TestUser,
  uniqueDay,
} from '../factories/index';

const app = createTestApp();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: TestUser;

beforeAll(async () => {
  staff = await signedInAgent(app, await createTestUser('staff'));
  customer = await createTestUser('customer', { name: 'Robin Packtest' });
});

// Net weights: 1 oz = 28.349523125 g and 1 lb = 453.59237 g exactly (NIST SP 811, App. B). Label
// form "Net Wt 12 oz (340 g)" per the FPLA and FDA 21 CFR 101.105. Fill weights are the declared
// mass rounded up to a whole gram:
//   12 oz = 340.194 g → label 340 g, fill 341 g;  1 lb = 453.592 g → label 454 g, fill 454 g;
//   8 oz = 226.796 g → label 227 g, fill 227 g.
const twelveOunce = { netLabel: 'Net Wt 12 oz (340 g)', netGrams: 341 };
const onePound = { netLabel: 'Net Wt 16 oz (1 lb) 454 g', netGrams: 454 };
const eightOunce = { netLabel: 'Net Wt 8 oz (227 g)', netGrams: 227 };

async function packList(date: string) {
  const response = await staff.get(`/api/roastery/days/${date}/pack-list`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return packListResponseSchema.parse(response.body);
}

describe('GET /api/roastery/days/:date/pack-list', () => {
  it('lists the orders that ship that day with one entry per bag and its label data, and leaves out unpaid, cancelled, refunded and other days’ orders', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    const roasted = await createRoastedOrder(customer.id, {
      roastDate,
      lines: [{ lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'medium', grind: 'pour-over', brewMethod: 'filter' }],
    });
    const green = await createGreenOrder(customer.id, lot.id, { shipDate: roasted.shipDate!, status: 'paid' });
    const left = [
      await createGreenOrder(customer.id, lot.id, { shipDate: roasted.shipDate!, status: 'pending_payment' }),
      await createGreenOrder(customer.id, lot.id, { shipDate: roasted.shipDate!, status: 'cancelled' }),
      await createGreenOrder(customer.id, lot.id, { shipDate: roasted.shipDate!, status: 'refunded' }),
      await createGreenOrder(customer.id, lot.id, { shipDate: uniqueDay(), status: 'paid' }),
    ];

    const list = await packList(roasted.shipDate!);

    expect(list.orders.map((order) => order.orderId).sort()).toEqual([roasted.id, green.id].sort());
    for (const order of left) expect(list.orders.map((entry) => entry.orderId)).not.toContain(order.id);
    const roastedEntry = list.orders.find((order) => order.orderId === roasted.id)!;
    expect(roastedEntry).toMatchObject({ customerName: 'Robin Packtest', kind: 'roasted', status: 'roasted', shipDate: roasted.shipDate, packedAt: null });
    expect(roastedEntry.bags).toHaveLength(2);
    expect(roastedEntry.bags.map((bag) => bag.bagNumber)).toEqual([1, 2]);
    for (const bag of roastedEntry.bags) {
      expect(bag).toMatchObject({
        coffee: lot.name,
        lotCode: lot.code,
        roastLevel: 'medium',
        grind: 'pour-over',
        size: '12oz',
        ...twelveOunce,
        roastDate,
        readyFrom: roasted.readyFrom,
        bestBefore: roasted.bestBefore,
        batchId: null,
      });
    }
    const greenEntry = list.orders.find((order) => order.orderId === green.id)!;
    expect(greenEntry.kind).toBe('green');
    expect(greenEntry.bags.map((bag) => ({ size: bag.size, netLabel: bag.netLabel, netGrams: bag.netGrams }))).toEqual([
      { size: '1lb', ...onePound },
      { size: '8oz', ...eightOunce },
      { size: '8oz', ...eightOunce },
    ]);
    for (const bag of greenEntry.bags)
      expect(bag).toMatchObject({ lotCode: lot.code, roastLevel: null, grind: null, roastDate: null, readyFrom: null, bestBefore: null });
  });

  it('says which bags go in which parcel: whole bags, the cheapest packing within the shop’s bands', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '1lb', quantity: 21, roastLevel: 'medium' }] });
    const green = await createGreenOrder(customer.id, lot.id, { shipDate: order.shipDate!, status: 'paid' });

    const list = await packList(order.shipDate!);

    // Restday's default bands (shared/schemas/settings.ts): ≤1 kg $8.95, ≤2 kg $11.95, ≤5 kg $16.95, ≤10 kg $24.95;
    // bag tare 20 g, box 180 g. A 1 lb bag packed: 454 + 20 = 474 g. The 10 kg box takes ⌊9,820 / 474⌋ = 20;
    // 21 bags cheapest as 20 + 1: 20 × 474 + 180 = 9,660 g ($24.95) and 474 + 180 = 654 g ($8.95), $33.90.
    const roasted = list.orders.find((entry) => entry.orderId === order.id)!;
    expect(roasted.parcelNote).toBeNull();
    expect(roasted.parcels).toEqual([
      { parcelNumber: 1, bagNumbers: Array.from({ length: 20 }, (_, index) => index + 1), grams: 9660, bandMaxGrams: 10_000, cents: 2495 },
      { parcelNumber: 2, bagNumbers: [21], grams: 654, bandMaxGrams: 1000, cents: 895 },
    ]);
    // 1 × 1 lb + 2 × 8 oz: 474 + 2 × (227 + 20) + 180 = 1,148 g → one parcel in the 2 kg band.
    expect(list.orders.find((entry) => entry.orderId === green.id)!.parcels).toEqual([
      { parcelNumber: 1, bagNumbers: [1, 2, 3], grams: 1148, bandMaxGrams: 2000, cents: 1195 },
    ]);
  });

  it('shows a Roaster’s Rotation bag as the lot picked for its roast day', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    await pickRotationLot(roastDate, lot.id);
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: null, size: '1lb', quantity: 1, roastLevel: 'dark' }] });

    const [entry] = (await packList(order.shipDate!)).orders;

    expect(entry!.bags).toEqual([expect.objectContaining({ coffee: lot.name, lotCode: lot.code, roastLevel: 'dark', ...onePound })]);
  });

  it('answers 400 naming the date when the day is not written YYYY-MM-DD', async () => {
    const response = await staff.get('/api/roastery/days/12-08-2026/pack-list');
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('date');
  });
});

describe('POST /api/orders/:id/pack', () => {
  it('allocates each roasted bag to a batch of its lot, level and roast day, marks it packed and queues one roasted e-mail; packing again changes nothing', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'medium' }] });
    const batch = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 3000 });

    const first = await staff.post(`/api/orders/${order.id}/pack`);

    expect(first.status, JSON.stringify(first.body)).toBe(200);
    const packed = packOrderSchema.parse(first.body);
    expect(packed).toMatchObject({ orderId: order.id, status: 'packed' });
    expect(packed.packedAt).not.toBeNull();
    expect(packed.bags.map((bag) => bag.batchId)).toEqual([batch.id, batch.id]);
    // 2 bags × 341 g fill = 682 g taken from the batch.
    expect(await allocationsOf(order.id)).toEqual([expect.objectContaining({ batchId: batch.id, bags: 2, grams: 682 })]);
    const [roastedEmail] = await outboxRows([`roasted:${order.id}`]);
    expect(roastedEmail).toMatchObject({ template: 'roasted', toAddress: customer.email });
    expect(roastedEmail!.payload).toMatchObject({ orderId: order.id, roastDate, readyFrom: order.readyFrom, shipDate: order.shipDate });
    expect((await packList(order.shipDate!)).orders[0]!.bags.map((bag) => bag.batchId)).toEqual([batch.id, batch.id]);

    const again = await staff.post(`/api/orders/${order.id}/pack`);

    expect(again.status).toBe(200);
    expect(packOrderSchema.parse(again.body).packedAt).toBe(packed.packedAt);
    expect(await allocationsOf(order.id)).toHaveLength(1);
    expect(await outboxRows([`roasted:${order.id}`])).toHaveLength(1);
  });

  it('packs an order whose bags were already filled from their batch without filling them twice', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    // 700 g roasted: room for the order's two 341 g bags, and no more.
    const batch = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'light', roastedGramsOut: 700 });
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'light' }] });
    const [item] = await getTestDb().select({ id: orderItems.id }).from(orderItems).where(eq(orderItems.orderId, order.id));
    await getTestDb().insert(bagAllocations).values({ orderId: order.id, orderItemId: item!.id, batchId: batch.id, bags: 2, grams: 682 });

    const response = await staff.post(`/api/orders/${order.id}/pack`);

    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(packOrderSchema.parse(response.body).status).toBe('packed');
    expect(await allocationsOf(order.id)).toEqual([expect.objectContaining({ batchId: batch.id, bags: 2, grams: 682 })]);
  });

  it('fills bags whole from the oldest batch first and carries the rest to the next batch', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    // The first batch holds two 341 g bags (682 g of 700 g); the third bag comes from the second batch.
    const older = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'light', roastedGramsOut: 700 });
    const newer = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'light', roastedGramsOut: 2000 });
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 3, roastLevel: 'light' }] });

    const response = await staff.post(`/api/orders/${order.id}/pack`);

    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(packOrderSchema.parse(response.body).bags.map((bag) => bag.batchId)).toEqual([older.id, older.id, newer.id]);
    expect(await allocationsOf(order.id)).toEqual([
      expect.objectContaining({ batchId: older.id, bags: 2, grams: 682 }),
      expect.objectContaining({ batchId: newer.id, bags: 1, grams: 341 }),
    ]);
  });

  it('answers 409 naming the lot when the recorded batches cannot fill the bags, and changes nothing', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    // Plenty of coffee, but at another level or on another day: neither may fill these bags.
    await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'dark', roastedGramsOut: 5000 });
    await recordBatch({ lotId: lot.id, roastDate: '2039-12-31', roastLevel: 'medium', roastedGramsOut: 5000 });
    await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 500 });
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'medium' }] });

    const response = await staff.post(`/api/orders/${order.id}/pack`);

    expect(response.status).toBe(409);
    const { error } = apiErrorSchema.parse(response.body);
    expect(error.code).toBe('batches_short');
    expect(error.message).toContain(lot.code);
    expect(error.message).toContain('682 g'); // 2 × 341 g
    expect(error.message).toContain('500 g');
    expect(await allocationsOf(order.id)).toEqual([]);
    expect(await orderStatusOf(order.id)).toMatchObject({ status: 'roasted', packedAt: null });
    expect(await outboxRows([`roasted:${order.id}`])).toEqual([]);
  });

  it('never lets two packers at once take more roasted coffee than a batch yielded', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    // 700 g holds two 341 g bags: exactly one of two 2-bag orders can have it.
    const batch = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 700 });
    const orders = [
      await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'medium' }] }),
      await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'medium' }] }),
    ];
    const secondPacker = await signedInAgent(app, await createTestUser('staff'));

    const responses = await Promise.all([staff.post(`/api/orders/${orders[0]!.id}/pack`), secondPacker.post(`/api/orders/${orders[1]!.id}/pack`)]);

    expect(responses.map((response) => response.status).sort()).toEqual([200, 409]);
    const taken = [...(await allocationsOf(orders[0]!.id)), ...(await allocationsOf(orders[1]!.id))];
    expect(taken.every((allocation) => allocation.batchId === batch.id)).toBe(true);
    expect(taken.reduce((sum, allocation) => sum + allocation.grams, 0)).toBe(682);
  });

  it('packs a green order without any batch, and moves a subscription delivery to roasted when its order is packed', async () => {
    const lot = await createLotForSale(20_000);
    const shipDate = uniqueDay();
    const green = await createGreenOrder(customer.id, lot.id, { shipDate, status: 'paid' });

    const greenPacked = await staff.post(`/api/orders/${green.id}/pack`);

    expect(greenPacked.status).toBe(200);
    expect(packOrderSchema.parse(greenPacked.body).status).toBe('packed');
    expect(await allocationsOf(green.id)).toEqual([]);
    expect(await outboxRows([`roasted:${green.id}`])).toEqual([]);

    const roastDate = uniqueDay();
    const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '1lb', quantity: 1, roastLevel: 'medium' }] });
    await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 1000 });
    const delivery = await deliveryFor(order.id, roastDate, lot.id);
    expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);
    const [row] = await getTestDb().select({ status: deliveries.status }).from(deliveries).where(eq(deliveries.id, delivery));
    expect(row!.status).toBe('roasted');
  });

  it('refuses with 409 to pack an order that is unpaid or cancelled, and changes nothing', async () => {
    const lot = await createLotForSale(20_000);
    for (const status of ['pending_payment', 'cancelled'] as const) {
      const order = await createGreenOrder(customer.id, lot.id, { shipDate: uniqueDay(), status });
      const response = await staff.post(`/api/orders/${order.id}/pack`);
      expect(response.status).toBe(409);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('not_packable');
      expect(await orderStatusOf(order.id)).toMatchObject({ status, packedAt: null });
    }
  });

  it('answers 404 for an order that does not exist', async () => {
    expect((await staff.post('/api/orders/5f0c2f1e-0000-4000-8000-000000000000/pack')).status).toBe(404);
  });
});

/** A subscription delivery whose order is `orderId` (as the subscription step links them). */
async function deliveryFor(orderId: string, roastDate: string, lotId: string) {
  const subscription = await createSubscription({ userId: customer.id, lotId, bagSize: '1lb', priceCents: 1500 });
  const delivery = await createDelivery({
    subscriptionId: subscription.id,
    orderId,
    roastDate,
    shipDate: roastDate,
    readyFrom: roastDate,
    bestBefore: roastDate,
  });
  return delivery.id;
}

describe('POST /api/roastery/days/:date/ship — mark all packed orders shipped', () => {
  it('ships every listed packed order of the day with one carrier and each its tracking number, and queues each shipped e-mail', async () => {
    const date = uniqueDay();
    const lot = await createLotForSale(20_000);
    const first = await createGreenOrder(customer.id, lot.id, { status: 'packed', shipDate: date });
    const second = await createGreenOrder(customer.id, lot.id, { status: 'packed', shipDate: date });

    const response = await staff.post(`/api/roastery/days/${date}/ship`).send({
      carrier: 'Invented Parcel Co',
      shipments: [
        { orderId: first.id, trackingNumber: 'ipc 0001' },
        { orderId: second.id, trackingNumber: 'ipc 0002' },
      ],
    });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const shipped = packListResponseSchema.parse(response.body).orders;
    expect(shipped.find((order) => order.orderId === first.id)).toMatchObject({ status: 'shipped', carrier: 'Invented Parcel Co', trackingNumber: 'IPC0001' });
    expect(shipped.find((order) => order.orderId === second.id)).toMatchObject({ status: 'shipped', trackingNumber: 'IPC0002' });
    expect(await outboxRows([`shipped:${first.id}`, `shipped:${second.id}`])).toHaveLength(2);
  });

  it('ships none when one order is not packed (409) or not on that day (400), and answers 400 naming the carrier when it is missing', async () => {
    const date = uniqueDay();
    const lot = await createLotForSale(20_000);
    const packed = await createGreenOrder(customer.id, lot.id, { status: 'packed', shipDate: date });
    const unpacked = await createGreenOrder(customer.id, lot.id, { status: 'paid', shipDate: date });
    const otherDay = await createGreenOrder(customer.id, lot.id, { status: 'packed', shipDate: uniqueDay() });
    const send = (orderIds: string[], carrier = 'Invented Parcel Co') =>
      staff
        .post(`/api/roastery/days/${date}/ship`)
        .send({ carrier, shipments: orderIds.map((orderId, index) => ({ orderId, trackingNumber: `IPC${index}` })) });

    expect((await send([packed.id, unpacked.id])).status).toBe(409);
    expect((await send([packed.id, otherDay.id])).status).toBe(400);
    const noCarrier = await send([packed.id], ' ');
    expect(noCarrier.status).toBe(400);
    expect(apiErrorSchema.parse(noCarrier.body).error.fields).toHaveProperty('carrier');
    expect((await orderStatusOf(packed.id)).status).toBe('packed');
    expect(await outboxRows([`shipped:${packed.id}`])).toHaveLength(0);
  });
});

describe('POST /api/orders/:id/ship — the shipped e-mail and the shop’s carriers', () => {
  // Invented carriers on reserved example domains.
  const carriers = [
    { name: 'Kestrel Post', trackingUrlTemplate: 'https://track.example.com/parcel/{tracking}' },
    { name: 'Larkspur Freight', trackingUrlTemplate: 'https://larkspur.example.net/find?number={tracking}' },
  ];
  beforeAll(async () => {
    await saveTestShopSettings({ carriers });
  });
  afterAll(async () => {
    await saveTestShopSettings();
  });

  async function shipAndRead(carrier: string, trackingNumber: string) {
    const recipient = await createCustomer('shipped');
    const lot = await createLotForSale(20_000);
    const order = await createGreenOrder(recipient.id, lot.id, { status: 'packed', shipDate: uniqueDay() });
    const response = await staff.post(`/api/orders/${order.id}/ship`).send({ carrier, trackingNumber });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const { relay, mailer } = testRelay({ smtpUrl: inject('smtpUrl') });
    const [mail] = await waitFor(
      async () => {
        await relay.relayOnce();
        return inboxOf(inject('mailCatcherUrl'), recipient.email);
      },
      (mails) => mails.length > 0,
      10_000,
      'the shipped e-mail',
    );
    mailer.close();
    return { order, text: mail!.text ?? '', html: mail!.html ?? '' };
  }

  it('links a listed carrier’s tracking page with the number in it, and the order page with its number', async () => {
    const { order, text, html } = await shipAndRead('larkspur freight', 'lf 77-01 a');
    // The Pack List keeps the number as staff typed it, upper-case and without spaces.
    expect(text).toContain('https://larkspur.example.net/find?number=LF77-01A');
    expect(html).toContain('Track your parcel');
    expect(text).toContain(`/orders/${order.id}`);
    expect(text).toContain(order.id.slice(0, 8).toUpperCase());
    expect(text).toContain('Larkspur Freight');
  });

  it('shows the tracking number alone for a carrier the shop has not listed', async () => {
    const { order, text, html } = await shipAndRead('Heron Parcel', 'HP123');
    expect(text).toContain('HP123');
    expect(html).not.toContain('Track your parcel');
    expect(text).not.toMatch(/example\.(com|net)/);
    expect(text).toContain(`/orders/${order.id}`);
  });
});
