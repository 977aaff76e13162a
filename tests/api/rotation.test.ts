import { and, desc, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { rotationPickResponseSchema, rotationResponseSchema } from '@shared/schemas/rotation';
import { auditLog, deliveries, lots, rotationPicks } from '../../server/db/schema/index';
import { createAdjustableClock } from '../../server/lib/clock';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { useCalendarOverrides, useShopSettings } from './subscriber-support';
import { createLotForSale, createTestUser, inventDelivery, inventDeliveryOrder, inventSubscription } from '../factories/index';

// The default shop: roasts Mon, Wed, Fri in New York; loss model defaults medium 15 %, dark 19 %
// (from memory) with a 2 % overage.
useShopSettings();
const override = useCalendarOverrides();
// Today in the shop is Tue 2 Mar 2032 (10:00 EST).
const clock = createAdjustableClock();
clock.set(new Date('2032-03-02T15:00:00Z'));
const app = createTestApp({ clock });

async function pickOn(roastDate: string) {
  const [row] = await getTestDb().select().from(rotationPicks).where(eq(rotationPicks.roastDate, roastDate));
  return row;
}

describe("the Roaster's Rotation", () => {
  it('lists open roast days with what their rotation subscribers need, and shows the lot once picked', async () => {
    await override('2032-03-05', { open: false, note: 'Closed for a trade fair' });
    await override('2032-03-06', { open: true, capacityGrams: 20_000 });
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const week = async () => {
      const response = await staff.get('/api/roastery/rotation').query({ from: '2032-03-01', to: '2032-03-07' });
      expect(response.status).toBe(200);
      return rotationResponseSchema.parse(response.body).days;
    };
    // Other tests' subscriptions share the database and run on for ever: count what this test adds.
    const before = await week();
    // Open: Mon 1 and Wed 3 (roast weekdays), Sat 6 (opened by the calendar); Fri 5 is closed.
    expect(before.map((day) => day.roastDate)).toEqual(['2032-03-01', '2032-03-03', '2032-03-06']);

    const customer = await createTestUser('customer');
    const plain = await inventSubscription(customer, { bagSize: '12oz', bagsPerDelivery: 2, roastLevel: 'medium', cadenceWeeks: 4 });
    const paid = await inventSubscription(customer, { bagSize: '1lb', bagsPerDelivery: 1, roastLevel: 'dark', cadenceWeeks: 4 });
    const paused = await inventSubscription(customer, { status: 'paused', pausedUntil: '2032-04-01', cadenceWeeks: 4 });
    const onLot = await inventSubscription(customer, { lotId: (await createLotForSale(5000)).id, cadenceWeeks: 4 });
    const skipping = await inventSubscription(customer, { cadenceWeeks: 4 });
    // Only the schedule grid knows this one's delivery on Sat 6 Mar (its anchor): 1 bag of 1 lb.
    await inventSubscription(customer, { bagSize: '1lb', bagsPerDelivery: 1, cadenceWeeks: 4, anchorDate: '2032-03-06' });
    await inventDelivery(plain, 1, '2032-03-03');
    // Paid for two 1 lb bags before the subscriber went down to one: the order's bags count.
    const paidDelivery = await inventDelivery(paid, 1, '2032-03-03');
    await inventDeliveryOrder(customer, paid, paidDelivery, { roastDate: '2032-03-03', size: '1lb', quantity: 2, roastLevel: 'dark' });
    await inventDelivery(paused, 1, '2032-03-03');
    await inventDelivery(onLot, 1, '2032-03-03');
    await inventDelivery(skipping, 1, '2032-03-03', 'skipped');
    // Its cutoff passed when it brought three bags: the frozen delivery counts, not today's choice.
    const frozen = await inventDelivery(plain, 2, '2032-03-06');
    await getTestDb()
      .update(deliveries)
      .set({ bagsPerDelivery: 3, bagSize: '12oz', roastLevel: 'medium', grind: 'whole-bean', brewMethod: 'filter' })
      .where(eq(deliveries.id, frozen));

    const after = await week();
    const added = after.map((day, index) => ({
      roastDate: day.roastDate,
      subscribers: day.subscribers - before[index]!.subscribers,
      bags: day.bags - before[index]!.bags,
      roastedGrams: day.roastedGrams - before[index]!.roastedGrams,
    }));
    expect(added).toEqual([
      // Mon 1 is over: only kept rows could count there, and this test keeps none.
      { roastDate: '2032-03-01', subscribers: 0, bags: 0, roastedGrams: 0 },
      // Wed 3: the 12 oz subscriber's 2 × 341 g and the paid order's 2 × 454 g = 1,590 g in 4 bags;
      // not the paused one, the one on a lot of its own, nor the skipped delivery.
      { roastDate: '2032-03-03', subscribers: 2, bags: 4, roastedGrams: 1590 },
      // Sat 6: the frozen 3 × 341 g and the grid's 1 × 454 g.
      { roastDate: '2032-03-06', subscribers: 2, bags: 4, roastedGrams: 1477 },
    ]);

    const lot = await createLotForSale(50_000);
    const saved = await staff.put('/api/roastery/rotation/2032-03-03').send({ lotCode: lot.code, note: 'Bright and sweet this week' });
    expect(saved.status).toBe(200);
    expect(rotationPickResponseSchema.parse(saved.body)).toEqual({
      roastDate: '2032-03-03',
      lotCode: lot.code,
      coffee: lot.name,
      note: 'Bright and sweet this week',
      warnings: [],
    });
    const days = rotationResponseSchema.parse((await staff.get('/api/roastery/rotation').query({ from: '2032-03-03', to: '2032-03-03' })).body).days;
    expect(days).toEqual([expect.objectContaining({ lotCode: lot.code, coffee: lot.name, note: 'Bright and sweet this week' })]);
    expect(await pickOn('2032-03-03')).toMatchObject({ lotId: lot.id });
  });

  it('records who chose a lot, and which one it replaced, in the audit trail', async () => {
    const staffUser = await createTestUser('staff');
    const staff = await signedInAgent(app, staffUser);
    const first = await createLotForSale(10_000);
    const second = await createLotForSale(10_000);
    expect((await staff.put('/api/roastery/rotation/2032-03-08').send({ lotCode: first.code })).status).toBe(200);
    expect((await staff.put('/api/roastery/rotation/2032-03-08').send({ lotCode: second.code })).status).toBe(200);
    const records = await getTestDb()
      .select({ detail: auditLog.detail })
      .from(auditLog)
      .where(and(eq(auditLog.action, 'rotation.picked'), eq(auditLog.actorId, staffUser.id)))
      .orderBy(desc(auditLog.at));
    expect(records.map((record) => record.detail)).toEqual([
      { roastDate: '2032-03-08', lotCode: second.code, previousLotCode: first.code },
      { roastDate: '2032-03-08', lotCode: first.code, previousLotCode: null },
    ]);
  });

  it('saves a lot that is not listed or short of green coffee, with a warning for each', async () => {
    // Sunday 21 Mar is opened for the test: no other test's subscription roasts on a Sunday.
    await override('2032-03-21', { open: true });
    const customer = await createTestUser('customer');
    const subscription = await inventSubscription(customer, { bagSize: '12oz', bagsPerDelivery: 2, roastLevel: 'medium', cadenceWeeks: 4 });
    const darker = await inventSubscription(customer, { bagSize: '2lb', bagsPerDelivery: 1, roastLevel: 'dark', cadenceWeeks: 4 });
    await inventDelivery(subscription, 1, '2032-03-21');
    await inventDelivery(darker, 1, '2032-03-21');
    const lot = await createLotForSale(1000);
    await getTestDb().update(lots).set({ isListed: false }).where(eq(lots.id, lot.id));

    const staff = await signedInAgent(app, await createTestUser('staff'));
    const response = await staff.put('/api/roastery/rotation/2032-03-21').send({ lotCode: lot.code });
    expect(response.status).toBe(200);
    // Green needed = roasted × 1.02 ÷ (1 − loss), rounded up: 682 g at 15 % → 819 g; 908 g at
    // 19 % → 1,144 g; 1,963 g in all against 1,000 g in stock.
    expect(rotationPickResponseSchema.parse(response.body).warnings).toEqual([
      { code: 'lot_not_listed', message: `${lot.name} is not listed in Green Lots.` },
      { code: 'short_of_stock', message: `The day's rotation needs about 1,963 g of green coffee; ${lot.name} has 1,000 g in stock.` },
    ]);
    expect(await pickOn('2032-03-21')).toMatchObject({ lotId: lot.id });
  });

  it('refuses a day that is over, closed, not a roast day or already roasted, and changes nothing', async () => {
    const lot = await createLotForSale(10_000);
    const staff = await signedInAgent(app, await createTestUser('staff'));
    await override('2032-03-12', { open: false });
    const customer = await createTestUser('customer');
    const subscription = await inventSubscription(customer);
    const delivery = await inventDelivery(subscription, 1, '2032-03-15', 'roasted');
    await inventDeliveryOrder(customer, subscription, delivery, { roastDate: '2032-03-15', size: '12oz', quantity: 1, status: 'roasted' });

    for (const [date, code] of [
      ['2032-03-01', 'roast_day_past'],
      ['2032-03-12', 'not_a_roast_day'],
      ['2032-03-16', 'not_a_roast_day'],
      ['2032-03-15', 'rotation_already_roasted'],
    ] as const) {
      const response = await staff.put(`/api/roastery/rotation/${date}`).send({ lotCode: lot.code });
      expect(response.status, date).toBe(409);
      expect(apiErrorSchema.parse(response.body).error.code).toBe(code);
      expect(await pickOn(date)).toBeUndefined();
    }
    expect((await staff.put('/api/roastery/rotation/2032-03-17').send({ lotCode: 'NO-SUCH-LOT' })).status).toBe(404);
    expect(await pickOn('2032-03-17')).toBeUndefined();
  });

  it('answers 400 naming the field for a bad date, lot or range', async () => {
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const badDate = await staff.put('/api/roastery/rotation/2032-02-30').send({ lotCode: 'ANY' });
    expect(badDate.status).toBe(400);
    expect(apiErrorSchema.parse(badDate.body).error.fields).toHaveProperty('date');
    const noLot = await staff.put('/api/roastery/rotation/2032-03-17').send({ note: 'x' });
    expect(noLot.status).toBe(400);
    expect(apiErrorSchema.parse(noLot.body).error.fields).toHaveProperty('lotCode');
    for (const range of [{ from: '2032-03-10', to: '2032-03-01' }, { from: '2032-01-01', to: '2032-06-30' }, { from: '2032-03-01' }]) {
      const response = await staff.get('/api/roastery/rotation').query(range);
      expect(response.status).toBe(400);
      expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('to');
    }
  });

  it('is closed to customers', async () => {
    const customer = await signedInAgent(app, await createTestUser('customer'));
    expect((await customer.get('/api/roastery/rotation').query({ from: '2032-03-01', to: '2032-03-07' })).status).toBe(403);
    expect((await customer.put('/api/roastery/rotation/2032-03-17').send({ lotCode: 'ANY' })).status).toBe(403);
  });
});
