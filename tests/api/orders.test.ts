import { eq } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { orderCsvColumns, orderDetailSchema, orderListResponseSchema } from '@shared/schemas/orders';
import type { OrderStatus } from '@shared/domain/vocabulary';
import { orders } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createLotForSale, createOrder, createTestUser, shipTo, type TestUser } from '../factories/index';

const app = createTestApp();

interface Invented {
  status?: OrderStatus;
  placedAt?: Date;
  roastDate?: string;
  totalCents?: number;
  carrier?: string;
}

/** An order written directly (one line of two 1 lb bags), as checkout or a subscription would leave it. */
async function inventOrder(owner: TestUser, lotId: string, { status = 'paid', placedAt = new Date(), roastDate, totalCents = 5000, carrier }: Invented = {}) {
  const order = await createOrder({
    userId: owner.id,
    status,
    shippingCents: 1000,
    roastDate: roastDate ?? null,
    carrier: carrier ?? null,
    createdAt: placedAt,
    lines: [{ lotId, size: '1lb', quantity: 2, unitPriceCents: (totalCents - 1000) / 2 }],
  });
  return order.id;
}

describe('GET /api/orders and /api/orders/:id for a customer', () => {
  it('lists only the customer’s own orders, newest first, and reads one in full', async () => {
    const lot = await createLotForSale(1000);
    const alice = await createTestUser('customer');
    const bob = await createTestUser('customer');
    const older = await inventOrder(alice, lot.id, { placedAt: new Date('2026-11-02T12:00:00Z') });
    const newer = await inventOrder(alice, lot.id, { placedAt: new Date('2026-11-20T12:00:00Z'), status: 'pending_payment' });
    await inventOrder(bob, lot.id);

    const agent = await signedInAgent(app, alice);
    const list = orderListResponseSchema.parse((await agent.get('/api/orders')).body);
    expect(list.items.map((item) => item.id)).toEqual([newer, older]);
    expect(list.total).toBe(2);
    expect(list.items[0]).toMatchObject({ status: 'pending_payment', bagCount: 2, totalCents: 5000, customer: { id: alice.id, email: alice.email } });

    const detail = await agent.get(`/api/orders/${older}`);
    expect(detail.status).toBe(200);
    expect(orderDetailSchema.parse(detail.body)).toMatchObject({
      id: older,
      kind: 'green',
      status: 'paid',
      subtotalCents: 4000,
      shippingCents: 1000,
      totalCents: 5000,
      items: [{ lotCode: lot.code, lotName: lot.name, size: '1lb', quantity: 2, fillGrams: 454, unitPriceCents: 2000, lineTotalCents: 4000 }],
      shippingAddress: { ...shipTo, line2: null, country: 'US' },
      roastDate: null,
    });
  });

  it('gives the expected arrival, skipping Christmas Day, and no ready-on-arrival for green coffee', async () => {
    const lot = await createLotForSale(1000);
    const customer = await createTestUser('customer');
    const id = await inventOrder(customer, lot.id);
    await getTestDb().update(orders).set({ shipDate: '2026-12-24' }).where(eq(orders.id, id));
    // Ships Thu 24 Dec 2026; 3 transit days (the default) skip Fri 25 (Christmas Day, 5 U.S.C. 6103)
    // and the weekend: Mon 28, Tue 29, Wed 30 Dec.
    const detail = orderDetailSchema.parse((await (await signedInAgent(app, customer)).get(`/api/orders/${id}`)).body);
    expect(detail).toMatchObject({ shipDate: '2026-12-24', expectedArrival: '2026-12-30', readyOnArrival: null });
  });

  it('answers 404 for another customer’s order, exactly as for one that does not exist', async () => {
    const lot = await createLotForSale(1000);
    const owner = await createTestUser('customer');
    const orderId = await inventOrder(owner, lot.id);
    const stranger = await signedInAgent(app, await createTestUser('customer'));
    const theirs = await stranger.get(`/api/orders/${orderId}`);
    const missing = await stranger.get('/api/orders/00000000-0000-4000-8000-000000000000');
    expect(theirs.status).toBe(404);
    expect(theirs.body).toEqual(missing.body);
    expect(apiErrorSchema.parse(theirs.body).error.code).toBe('not_found');
  });

  it('answers 401 without a session, and 403 for a customer asking for the CSV', async () => {
    expect((await request(app).get('/api/orders')).status).toBe(401);
    const customer = await signedInAgent(app, await createTestUser('customer'));
    expect((await customer.get('/api/orders.csv')).status).toBe(403);
  });
});

describe('the staff orders table', () => {
  it('filters by status, roast date and the days placed, sorts by total, and pages', async () => {
    const lot = await createLotForSale(1000);
    const alice = await createTestUser('customer');
    const bob = await createTestUser('customer');
    const roastDate = '2031-04-08';
    const first = await inventOrder(alice, lot.id, { roastDate, totalCents: 3000, placedAt: new Date('2021-03-01T12:00:00Z') });
    const second = await inventOrder(bob, lot.id, { roastDate, totalCents: 9000, placedAt: new Date('2021-03-02T12:00:00Z') });
    const held = await inventOrder(bob, lot.id, { roastDate, totalCents: 6000, status: 'held', placedAt: new Date('2021-03-03T12:00:00Z') });
    const staff = await signedInAgent(app, await createTestUser('staff'));

    const byRoastDay = orderListResponseSchema.parse((await staff.get('/api/orders').query({ roastDate, sort: 'total-high' })).body);
    expect(byRoastDay.items.map((item) => item.id)).toEqual([second, held, first]);
    expect(new Set(byRoastDay.items.map((item) => item.customer.id))).toEqual(new Set([alice.id, bob.id]));

    const paidOnly = orderListResponseSchema.parse((await staff.get('/api/orders').query({ roastDate, status: 'paid', sort: 'oldest' })).body);
    expect(paidOnly.items.map((item) => item.id)).toEqual([first, second]);

    const placed = orderListResponseSchema.parse((await staff.get('/api/orders').query({ from: '2021-03-02', to: '2021-03-03' })).body);
    expect(placed.items.map((item) => item.id)).toEqual([held, second]);

    const paged = orderListResponseSchema.parse((await staff.get('/api/orders').query({ roastDate, sort: 'oldest', page: 2, pageSize: 2 })).body);
    expect(paged).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(paged.items.map((item) => item.id)).toEqual([held]);

    const detail = await staff.get(`/api/orders/${first}`);
    expect(detail.status).toBe(200);
    expect(orderDetailSchema.parse(detail.body).customer.id).toBe(alice.id);
  });

  it('answers 400 naming the field for a bad status or date range', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const badStatus = await staff.get('/api/orders').query({ status: 'lost' });
    expect(badStatus.status).toBe(400);
    expect(apiErrorSchema.parse(badStatus.body).error.fields).toHaveProperty('status');
    const backwards = await staff.get('/api/orders').query({ from: '2026-12-09', to: '2026-12-01' });
    expect(backwards.status).toBe(400);
    expect(apiErrorSchema.parse(backwards.body).error.fields).toHaveProperty('to');
  });

  it('exports the filtered orders as CSV with the documented columns, formulas neutralised', async () => {
    const lot = await createLotForSale(1000);
    const customer = await createTestUser('customer', { name: '=1+2 Invented' });
    const roastDate = '2031-05-13';
    const orderId = await inventOrder(customer, lot.id, { roastDate, totalCents: 7000, carrier: 'Invented Parcel' });
    const staff = await signedInAgent(app, await createTestUser('staff'));

    const response = await staff.get('/api/orders.csv').query({ roastDate });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toBe('attachment; filename=restday-orders.csv');
    // No cell here holds a comma, quote or line break, so the lines split plainly.
    const [header, ...rows] = response.text
      .trimEnd()
      .split('\n')
      .map((line) => line.split(','));
    expect(header).toEqual([...orderCsvColumns]);
    expect(rows).toHaveLength(1);
    const record = Object.fromEntries(header!.map((column, index) => [column, rows[0]![index]]));
    expect(record).toMatchObject({
      order_id: orderId,
      kind: 'green',
      status: 'paid',
      customer_name: "'=1+2 Invented",
      customer_email: customer.email,
      bags: '2',
      subtotal_cents: '6000',
      shipping_cents: '1000',
      total_cents: '7000',
      refunded_cents: '0',
      roast_date: roastDate,
      ship_date: '',
      carrier: 'Invented Parcel',
      tracking_number: '',
    });
  });
});

describe('GET /api/orders?q= — staff search by name, e-mail or order reference', () => {
  it('finds the orders of a customer by part of their name or e-mail, and one order by the start of its reference; % matches only itself', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const marker = `Quillon${Date.now()}`;
    const customer = await createTestUser('customer', { name: `Ada ${marker}` });
    const first = await createOrder({ userId: customer.id, status: 'paid', subtotalCents: 1899 });
    const second = await createOrder({ userId: customer.id, status: 'paid', subtotalCents: 2500 });
    const search = async (q: string) => orderListResponseSchema.parse((await staff.get('/api/orders').query({ q, pageSize: 200 })).body);

    const byName = await search(marker.toLowerCase());
    expect(byName.items.map((order) => order.id).sort()).toEqual([first.id, second.id].sort());
    expect(byName.total).toBe(2);
    const byEmail = await search(customer.email.slice(0, 12).toUpperCase());
    expect(byEmail.items.map((order) => order.id)).toEqual(expect.arrayContaining([first.id, second.id]));
    // The reference people read: the id's first eight characters, upper-case.
    const reference = first.id.replace(/-/g, '').slice(0, 8).toUpperCase();
    expect((await search(reference)).items.map((order) => order.id)).toContain(first.id);
    expect((await search(`${marker}%`)).total).toBe(0);
  });

  it('answers 400 naming q for a search longer than 100 characters', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const response = await staff.get('/api/orders').query({ q: 'x'.repeat(101) });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('q');
  });
});
