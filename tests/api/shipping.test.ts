import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { packOrderSchema } from '@shared/schemas/packing';
import { formatDay } from '../../emails/parts/format';
import { createTestApp } from '../setup/test-app';
import { createTestUser, signedInAgent, type TestUser } from '../setup/test-users';
import { createLotForSale } from './checkout-support';
import { inboxOf, outboxRows, testRelay, waitFor } from './outbox-support';
import { createGreenOrderShipping, createRoastedOrder, orderStatusOf, recordBatch, uniqueDay } from './packing-support';

const app = createTestApp();
const mailCatcherUrl = inject('mailCatcherUrl');
const { relay, mailer } = testRelay({ smtpUrl: inject('smtpUrl') });
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let lot: { id: string; code: string; name: string };

beforeAll(async () => {
  staff = await signedInAgent(app, await createTestUser('staff'));
  lot = await createLotForSale(20_000);
});

afterAll(() => mailer.close());

/** A roasted order of one 12 oz bag, roasted and packed through the API. */
async function packedRoastedOrder(customer: TestUser) {
  const roastDate = uniqueDay();
  const order = await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 1, roastLevel: 'medium' }] });
  await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 1000 });
  expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);
  return order;
}

const parcel = { carrier: 'Invented Parcel Co', trackingNumber: '9400 1000 0000 0000 0000 00' };

describe('POST /api/orders/:id/ship', () => {
  it('marks a packed order shipped and e-mails the carrier, tracking number and ready-from date once', async () => {
    const customer = await createTestUser('customer');
    const order = await packedRoastedOrder(customer);

    const response = await staff.post(`/api/orders/${order.id}/ship`).send(parcel);

    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const shipped = packOrderSchema.parse(response.body);
    expect(shipped).toMatchObject({ status: 'shipped', carrier: 'Invented Parcel Co', trackingNumber: '9400100000000000000000' });
    expect(shipped.shippedAt).not.toBeNull();
    await relay.relayOnce();
    const inbox = await waitFor(() => inboxOf(mailCatcherUrl, customer.email), (mail) => mail.some((email) => email.subject === 'Your coffee is on its way'), 10_000, 'the shipped e-mail');
    const shippedMail = inbox.filter((mail) => mail.subject === 'Your coffee is on its way');
    expect(shippedMail).toHaveLength(1);
    const [email] = shippedMail;
    expect(email!.text).toContain('Invented Parcel Co');
    expect(email!.text).toContain('9400100000000000000000');
    expect(email!.text).toContain(formatDay(order.readyFrom!));
  });

  it('changes nothing when shipped again with the same carrier and number, and answers 409 for different ones', async () => {
    const customer = await createTestUser('customer');
    const order = await packedRoastedOrder(customer);
    const first = packOrderSchema.parse((await staff.post(`/api/orders/${order.id}/ship`).send(parcel)).body);

    const same = await staff.post(`/api/orders/${order.id}/ship`).send({ carrier: ' Invented Parcel Co ', trackingNumber: '9400100000000000000000' });
    const different = await staff.post(`/api/orders/${order.id}/ship`).send({ carrier: 'Invented Parcel Co', trackingNumber: 'ZZ999' });

    expect(same.status).toBe(200);
    expect(packOrderSchema.parse(same.body).shippedAt).toBe(first.shippedAt);
    expect(different.status).toBe(409);
    expect(apiErrorSchema.parse(different.body).error.code).toBe('already_shipped');
    expect(await orderStatusOf(order.id)).toMatchObject({ status: 'shipped', trackingNumber: '9400100000000000000000' });
    expect(await outboxRows([`shipped:${order.id}`])).toHaveLength(1);
  });

  it('answers 409 for an order that is not packed yet, and changes nothing', async () => {
    const customer = await createTestUser('customer');
    const order = await createRoastedOrder(customer.id, { roastDate: uniqueDay(), lines: [{ lotId: lot.id, size: '1lb', quantity: 1, roastLevel: 'light' }] });

    const response = await staff.post(`/api/orders/${order.id}/ship`).send(parcel);

    expect(response.status).toBe(409);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('not_packed');
    expect(await orderStatusOf(order.id)).toMatchObject({ status: 'roasted', shippedAt: null, carrier: null });
    expect(await outboxRows([`shipped:${order.id}`])).toEqual([]);
  });

  it('answers 400 naming the field for a missing carrier or a tracking number with other characters, and changes nothing', async () => {
    const customer = await createTestUser('customer');
    const order = await packedRoastedOrder(customer);

    const noCarrier = await staff.post(`/api/orders/${order.id}/ship`).send({ trackingNumber: 'AB123' });
    const badNumber = await staff.post(`/api/orders/${order.id}/ship`).send({ carrier: 'Invented Parcel Co', trackingNumber: '<b>AB123</b>' });

    expect(noCarrier.status).toBe(400);
    expect(apiErrorSchema.parse(noCarrier.body).error.fields).toHaveProperty('carrier');
    expect(badNumber.status).toBe(400);
    expect(apiErrorSchema.parse(badNumber.body).error.fields).toHaveProperty('trackingNumber');
    expect(await orderStatusOf(order.id)).toMatchObject({ status: 'packed', shippedAt: null });
    expect(await outboxRows([`shipped:${order.id}`])).toEqual([]);
  });

  it('ships a green order with the green-coffee e-mail, which has no ready-from date', async () => {
    const customer = await createTestUser('customer');
    const order = await createGreenOrderShipping(customer.id, lot.id, uniqueDay());
    expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);

    expect((await staff.post(`/api/orders/${order.id}/ship`).send(parcel)).status).toBe(200);

    const [row] = await outboxRows([`shipped:${order.id}`]);
    expect(row).toMatchObject({ template: 'shipped', subject: 'Your green coffee is on its way' });
    expect(row!.payload).toMatchObject({ kind: 'green', trackingNumber: '9400100000000000000000' });
    expect(row!.payload).not.toHaveProperty('readyFrom');
  });
});
