import { randomInt } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@shared/domain/shop-time';
import { apiErrorSchema } from '@shared/schemas/errors';
import { ledgerResponseSchema } from '@shared/schemas/ledger';
import { createAdjustableClock } from '../../server/lib/clock';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { createLot, createOrder, createSubscription, createTestUser, recordBatch, type OrderFields } from '../factories/index';

// A week of its own in 2092–2099 (other files' rows sit in 2040–2089 or now), Monday to Sunday.
const monday = addDays('2092-01-07', 7 * randomInt(0, 400)); // 7 January 2092 is a Monday
// 17:00 UTC is the same day in every US time zone the shop might be set to.
const middayOf = (day: number) => new Date(`${addDays(monday, day)}T17:00:00Z`);
const clock = createAdjustableClock();
clock.set(middayOf(4)); // Friday of the week
const app = createTestApp({ clock });

let owner: Awaited<ReturnType<typeof signedInAgent>>;
let lot: Awaited<ReturnType<typeof createLot>>;

/** 1 × 1 lb at $18.99 and 2 × 8 oz at $10.50, plus $8.50 shipping: $48.49, 454 + 2 × 227 = 908 g of green. */
function greenOrder(userId: string, fields: Partial<OrderFields> = {}) {
  return createOrder({
    userId,
    shippingCents: 850,
    lines: [
      { lotId: lot.id, size: '1lb', quantity: 1, unitPriceCents: 1899 },
      { lotId: lot.id, size: '8oz', quantity: 2, unitPriceCents: 1050 },
    ],
    ...fields,
  });
}

beforeAll(async () => {
  owner = await signedInAgent(app, await createTestUser('owner'));
  lot = await createLot({ stockGrams: 50_000 });
  const buyer = await createTestUser('customer');

  // Three green orders paid on Monday, Wednesday and Friday; Wednesday's is refunded $18.99 on Thursday.
  await greenOrder(buyer.id, { status: 'paid', paidAt: middayOf(0) });
  await greenOrder(buyer.id, { status: 'paid', paidAt: middayOf(2), refundedCents: 1899, refundedAt: middayOf(3) });
  await greenOrder(buyer.id, { status: 'paid', paidAt: middayOf(4) });
  // Two subscription deliveries paid Tuesday and Thursday: 2 × 12 oz at $17.55 + $6.25 shipping = $41.35 each.
  // It started on Tuesday and paused on Wednesday; another, a year old, was cancelled on Thursday.
  const subscription = await createSubscription({
    userId: buyer.id,
    status: 'paused',
    lotId: lot.id,
    priceCents: 4135,
    cadenceWeeks: 1,
    bagsPerDelivery: 2,
    createdAt: middayOf(1),
    pausedAt: middayOf(2),
    pausedUntil: addDays(monday, 60),
  });
  await createSubscription({ userId: buyer.id, status: 'cancelled', createdAt: middayOf(-365), cancelledAt: middayOf(3) });
  for (const day of [1, 3]) {
    await createOrder({
      userId: buyer.id,
      kind: 'roasted',
      status: 'paid',
      paidAt: middayOf(day),
      subscriptionId: subscription.id,
      roastDate: addDays(monday, day + 5),
      shippingCents: 625,
      lines: [{ lotId: lot.id, size: '12oz', quantity: 2, unitPriceCents: 1755, roastLevel: 'medium' }],
    });
  }
  // Paid the Friday before, and never paid: neither belongs to the week.
  await greenOrder(buyer.id, { status: 'paid', paidAt: middayOf(-3) });
  await greenOrder(buyer.id);
  // Two batches of the lot at medium in the week: 10,000 g green in, 8,500 g out each (15 % loss).
  await recordBatch({ lotId: lot.id, roastDate: addDays(monday, 1), roastLevel: 'medium', roastedGramsOut: 8500 });
  await recordBatch({ lotId: lot.id, roastDate: addDays(monday, 3), roastLevel: 'medium', roastedGramsOut: 8500 });
});

describe('GET /api/owner/ledger', () => {
  it('sums a week worked by hand: 3 green orders, 2 deliveries and one refund', async () => {
    const response = await owner.get('/api/owner/ledger?weeks=2');
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const ledger = ledgerResponseSchema.parse(response.body);
    expect(ledger.weeks).toBe(2);
    expect(ledger.from).toBe(addDays(monday, -7));
    expect(ledger.to).toBe(addDays(monday, 6));

    const [before, week] = ledger.sales;
    expect(week).toEqual({
      weekStart: monday,
      greenCents: 3 * 4849, // 14,547: three $48.49 orders
      roastedCents: 0,
      subscriptionCents: 2 * 4135, // 8,270: two $41.35 deliveries
      totalCents: 3 * 4849 + 2 * 4135, // 22,817
      refundsCents: 1899, // made on Thursday
      orders: 5,
    });
    // The week before holds only the Friday order; the unpaid one is nowhere.
    expect(before).toMatchObject({ weekStart: addDays(monday, -7), greenCents: 4849, orders: 1, refundsCents: 0 });

    // Green sold: 3 orders × 908 g = 2,724 g (1 lb → 454 g, 8 oz → 227 g, rounded up from NIST SP 811 App. B).
    // Roasted: two batches of 10,000 g green in (8,500 ÷ 0.85).
    expect(ledger.green[1]).toEqual({ weekStart: monday, soldGreenGrams: 2724, roastedGreenGrams: 20_000 });
    expect(ledger.green[0]).toMatchObject({ soldGreenGrams: 908 });

    // Loss by lot: (20,000 − 17,000) ÷ 20,000 = 15 %, inside medium's 14–16 % (from memory: the loss model's defaults).
    const loss = ledger.loss.filter((row) => row.lotCode === lot.code);
    expect(loss).toEqual([
      {
        lotCode: lot.code,
        name: lot.name,
        roastLevel: 'medium',
        batches: 2,
        greenGramsIn: 20_000,
        roastedGramsOut: 17_000,
        lossPct: 15,
        expected: expect.objectContaining({ minPct: expect.any(Number), maxPct: expect.any(Number), defaultPct: expect.any(Number) }) as unknown,
        position: 'within',
      },
    ]);
    // Subscriptions that started, paused and were cancelled in the week (no other file's rows are dated in it).
    expect(ledger.subscriptions[1]).toMatchObject({ weekStart: monday, started: 1, paused: 1, cancelled: 1 });
  });

  it('gives each table as CSV', async () => {
    const sales = await owner.get('/api/owner/ledger/sales.csv?weeks=2');
    expect(sales.status).toBe(200);
    expect(sales.headers['content-disposition']).toContain(`ledger-sales-${addDays(monday, -7)}-${addDays(monday, 6)}.csv`);
    const lines = sales.text.trim().split('\n');
    expect(lines[0]).toBe('week_start,currency,green_cents,roasted_cents,subscription_cents,total_cents,refunds_cents,orders');
    expect(lines[2]).toMatch(new RegExp(`^${monday},[a-z]{3},14547,0,8270,22817,1899,5$`));
    for (const table of ['subscriptions', 'green', 'loss']) {
      const csv = await owner.get(`/api/owner/ledger/${table}.csv?weeks=2`);
      expect(csv.status, table).toBe(200);
      expect(csv.headers['content-type']).toContain('text/csv');
    }
    const loss = await owner.get('/api/owner/ledger/loss.csv?weeks=2');
    expect(loss.text).toContain(`${lot.code},`);
  });

  it('is for the owner only: staff and customers get 403, a visitor 401', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const customer = await signedInAgent(app, await createTestUser('customer'));
    for (const agent of [staff, customer]) {
      const response = await agent.get('/api/owner/ledger?weeks=12');
      expect(response.status).toBe(403);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('forbidden');
      expect((await agent.get('/api/owner/ledger/sales.csv')).status).toBe(403);
    }
    expect((await request(app).get('/api/owner/ledger')).status).toBe(401);
  });

  it('when weeks is not a whole number from 1 to 104, then 400 naming the field', async () => {
    for (const weeks of ['0', '105', 'twelve', '2.5']) {
      const response = await owner.get(`/api/owner/ledger?weeks=${weeks}`);
      expect(response.status, weeks).toBe(400);
      expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(['weeks']);
    }
  });
});
