import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { subscriberCsvColumns, subscriberDetailSchema, subscriberListResponseSchema } from '@shared/schemas/subscribers';
import { eq } from 'drizzle-orm';
import { subscriptions } from '../../server/db/schema/index';
import { createAdjustableClock } from '../../server/lib/clock';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { useShopSettings } from './subscriber-support';
import { createLotForSale, createTestUser, inventDelivery, inventDeliveryOrder, inventSubscription, pickRotationLot } from '../factories/index';

useShopSettings();
// Today in the shop (New York) is Tue 4 Mar 2031.
const clock = createAdjustableClock();
clock.set(new Date('2031-03-04T15:00:00Z'));
const app = createTestApp({ clock });

/** Customers whose names share a tag no other test uses, so `q` narrows the table to this test's rows. */
async function customers(...names: string[]) {
  const tag = `Quill${randomUUID().slice(0, 6)}`;
  const people = await Promise.all(names.map((name) => createTestUser('customer', { name: `${name} ${tag}` })));
  return { tag, people };
}

describe('GET /api/roastery/subscribers', () => {
  it('lists subscriptions with their coffee and next roast date, filtered by status, level, cadence and lot', async () => {
    const lot = await createLotForSale(10_000);
    const { tag, people } = await customers('Avery', 'Blake', 'Casey', 'Drew');
    const [avery, blake, casey, drew] = people as [(typeof people)[0], (typeof people)[0], (typeof people)[0], (typeof people)[0]];
    const onLot = await inventSubscription(avery, { lotId: lot.id, roastLevel: 'light', cadenceWeeks: 1, createdAt: new Date('2031-01-02T12:00:00Z') });
    const rotation = await inventSubscription(blake, { roastLevel: 'dark', cadenceWeeks: 2, bagSize: '2lb', createdAt: new Date('2031-01-03T12:00:00Z') });
    const paused = await inventSubscription(casey, {
      status: 'paused',
      pausedUntil: '2031-04-01',
      cadenceWeeks: 4,
      createdAt: new Date('2031-01-04T12:00:00Z'),
    });
    await inventSubscription(drew, { status: 'incomplete', createdAt: new Date('2031-01-05T12:00:00Z') });
    // Avery: yesterday's delivery is past; the 5th is skipped; the next to roast is Fri 7 Mar.
    await inventDelivery(onLot, 1, '2031-03-03', 'roasted');
    await inventDelivery(onLot, 2, '2031-03-05', 'skipped');
    await inventDelivery(onLot, 3, '2031-03-07');
    await inventDelivery(rotation, 1, '2031-03-05', 'held');

    const staff = await signedInAgent(app, await createTestUser('staff'));
    const list = async (query: Record<string, string>) => {
      const response = await staff.get('/api/roastery/subscribers').query({ q: tag, ...query });
      expect(response.status).toBe(200);
      return subscriberListResponseSchema.parse(response.body);
    };

    const all = await list({});
    // Newest first; the never-paid checkout (incomplete) is not a subscriber.
    expect(all.items.map((item) => item.id)).toEqual([paused, rotation, onLot]);
    expect(all.total).toBe(3);
    expect(all.items[2]).toMatchObject({
      customerName: avery.name,
      email: avery.email,
      status: 'active',
      coffee: lot.name,
      lotCode: lot.code,
      roastLevel: 'light',
      cadenceWeeks: 1,
      nextRoastDate: '2031-03-07',
      createdAt: '2031-01-02T12:00:00.000Z',
    });
    expect(all.items[1]).toMatchObject({ coffee: "Roaster's Rotation", lotCode: null, bagSize: '2lb', nextRoastDate: '2031-03-05' });
    expect(all.items[0]).toMatchObject({ status: 'paused', nextRoastDate: null });

    expect((await list({ status: 'paused' })).items.map((item) => item.id)).toEqual([paused]);
    expect((await list({ status: 'incomplete' })).total).toBe(1);
    expect((await list({ level: 'dark' })).items.map((item) => item.id)).toEqual([rotation]);
    expect((await list({ cadence: '1' })).items.map((item) => item.id)).toEqual([onLot]);
    expect((await list({ lot: lot.code })).items.map((item) => item.id)).toEqual([onLot]);
    expect((await list({ lot: 'rotation' })).items.map((item) => item.id)).toEqual([paused, rotation]);
    expect((await list({ q: avery.email })).items.map((item) => item.id)).toEqual([onLot]);
    expect((await list({ sort: 'next-roast' })).items.map((item) => item.id)).toEqual([rotation, onLot, paused]);
    expect((await list({ sort: 'name' })).items.map((item) => item.id)).toEqual([onLot, rotation, paused]);
    const secondPage = await list({ sort: 'oldest', pageSize: '2', page: '2' });
    expect(secondPage).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(secondPage.items.map((item) => item.id)).toEqual([paused]);
  });

  it('reads the next roast date from the schedule grid when no delivery row is kept yet', async () => {
    const { tag, people } = await customers('Gale', 'Harper');
    // Every 2 weeks from Mon 3 Mar 2031: today (Tue 4 Mar) the next is Mon 17 Mar.
    const gridOnly = await inventSubscription(people[0]!, { anchorDate: '2031-03-03', cadenceWeeks: 2 });
    // The same, but ending with its paid period: nothing more is due.
    const ending = await inventSubscription(people[1]!, { anchorDate: '2031-03-03', cadenceWeeks: 2 });
    await getTestDb().update(subscriptions).set({ cancelAtPeriodEnd: true }).where(eq(subscriptions.id, ending));
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const list = subscriberListResponseSchema.parse((await staff.get('/api/roastery/subscribers').query({ q: tag, sort: 'name' })).body);
    expect(list.items.map((item) => [item.id, item.nextRoastDate])).toEqual([
      [gridOnly, '2031-03-17'],
      [ending, null],
    ]);
    const detail = subscriberDetailSchema.parse((await staff.get(`/api/roastery/subscribers/${ending}`)).body);
    expect(detail).toMatchObject({ cancelAtPeriodEnd: true, nextRoastDate: null, deliveries: [] });
  });

  it('answers 400 naming each bad filter', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const response = await staff.get('/api/roastery/subscribers').query({ status: 'sleeping', cadence: '5', sort: 'loudest', page: '0' });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {}).sort()).toEqual(['cadence', 'page', 'sort', 'status']);
  });

  it('is closed to customers', async () => {
    const customer = await signedInAgent(app, await createTestUser('customer'));
    expect((await customer.get('/api/roastery/subscribers')).status).toBe(403);
    expect((await customer.get('/api/roastery/subscribers.csv')).status).toBe(403);
  });
});

describe('GET /api/roastery/subscribers.csv', () => {
  it('exports every match with the same filters, and keeps a typed formula as text', async () => {
    const { tag, people } = await customers('=SUM(1+2)', 'Ellis');
    const [formula, ellis] = people as [(typeof people)[0], (typeof people)[0]];
    const first = await inventSubscription(formula, { priceCents: 2515, createdAt: new Date('2031-02-01T12:00:00Z') });
    await inventSubscription(ellis, { status: 'cancelled', createdAt: new Date('2031-02-02T12:00:00Z') });
    await inventDelivery(first, 1, '2031-03-10');

    const staff = await signedInAgent(app, await createTestUser('owner'));
    const response = await staff.get('/api/roastery/subscribers.csv').query({ q: tag, status: 'active' });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toBe('attachment; filename=restday-subscribers.csv');
    // No cell here holds a comma, quote or line break, so the lines split plainly.
    const [header, ...rows] = response.text
      .trimEnd()
      .split('\n')
      .map((line) => line.split(','));
    expect(header).toEqual([...subscriberCsvColumns]);
    expect(rows).toHaveLength(1);
    expect(Object.fromEntries(header!.map((column, index) => [column, rows[0]![index]]))).toMatchObject({
      subscription_id: first,
      status: 'active',
      customer_name: `'=SUM(1+2) ${tag}`,
      coffee: "Roaster's Rotation",
      lot_code: '',
      cadence_weeks: '2',
      price_cents: '2515',
      next_roast_date: '2031-03-10',
    });
  });
});

describe('GET /api/roastery/subscribers/:id', () => {
  it("shows the subscription with its customer, address, deliveries (with the rotation's picked lot) and orders", async () => {
    const picked = await createLotForSale(20_000);
    const { people } = await customers('Frankie');
    const frankie = people[0]!;
    const subscriptionId = await inventSubscription(frankie, { cadenceWeeks: 1, currentPeriodEnd: new Date('2031-03-09T17:00:00Z') });
    const roasted = await inventDelivery(subscriptionId, 1, '2031-02-26', 'roasted');
    const orderId = await inventDeliveryOrder(frankie, subscriptionId, roasted, {
      roastDate: '2031-02-26',
      size: '12oz',
      quantity: 1,
      status: 'roasted',
      lotId: picked.id,
    });
    await inventDelivery(subscriptionId, 2, '2031-03-05');
    await pickRotationLot('2031-02-26', picked.id);

    const staff = await signedInAgent(app, await createTestUser('staff'));
    const response = await staff.get(`/api/roastery/subscribers/${subscriptionId}`);
    expect(response.status).toBe(200);
    const detail = subscriberDetailSchema.parse(response.body);
    expect(detail).toMatchObject({
      id: subscriptionId,
      customer: { id: frankie.id, name: frankie.name, email: frankie.email },
      coffee: "Roaster's Rotation",
      status: 'active',
      currentPeriodEnd: '2031-03-09T17:00:00.000Z',
      shippingAddress: { line1: '4 Larkspur Lane', city: 'Wrenfield', line2: null },
      nextRoastDate: '2031-03-05',
    });
    expect(detail.deliveries.map((delivery) => [delivery.sequence, delivery.roastDate, delivery.status, delivery.lotCode, delivery.order?.id ?? null])).toEqual(
      [
        [1, '2031-02-26', 'roasted', picked.code, orderId],
        [2, '2031-03-05', 'scheduled', null, null],
      ],
    );
    expect(detail.orders).toEqual([expect.objectContaining({ id: orderId, status: 'roasted', bags: 1, totalCents: 1620 + 895, roastDate: '2031-02-26' })]);
  });

  it('answers 404 for a subscription that does not exist and 400 for an id that is not one', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    expect((await staff.get('/api/roastery/subscribers/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    const malformed = await staff.get('/api/roastery/subscribers/not-an-id');
    expect(malformed.status).toBe(400);
    expect(apiErrorSchema.parse(malformed.body).error.fields).toHaveProperty('id');
  });
});
