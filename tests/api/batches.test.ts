import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { defaultLossModel } from '@shared/domain/roast-loss';
import { apiErrorSchema } from '@shared/schemas/errors';
import { batchCreatedSchema, batchListResponseSchema, roastListResponseSchema } from '@shared/schemas/roastery';
import { batches, lots, stockMovements } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createPaidRoastedOrder, createStockedLot, createTestUser, runTag, saveTestShopSettings, type TestUser } from '../factories/index';

// Invented lots and batches on dates of this file's own.
const tag = runTag();
const roastDate = '2031-04-02';
let app: ReturnType<typeof createTestApp>;
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let staffUser: TestUser;
let customer: TestUser;
let badLots = 0;

async function lotState(lotId: string) {
  const db = getTestDb();
  const [lot] = await db.select({ stockGrams: lots.stockGrams }).from(lots).where(eq(lots.id, lotId));
  const movements = await db.select().from(stockMovements).where(eq(stockMovements.lotId, lotId));
  const recorded = await db.select().from(batches).where(eq(batches.lotId, lotId));
  return { stockGrams: lot!.stockGrams, movements, batches: recorded };
}

beforeAll(async () => {
  app = createTestApp();
  staffUser = await createTestUser('staff', { name: 'Invented Roaster' });
  [staff, customer] = await Promise.all([signedInAgent(app, staffUser), createTestUser('customer')]);
  // Medium 14–16 %, default 15 % (from memory); the lot's own loss after 3 batches.
  await saveTestShopSettings({ lossModel: defaultLossModel, lossModelMinBatches: 3 });
});

describe('POST /api/roastery/batches', () => {
  it('takes each batch’s green out of stock and, after the third batch, plans the lot with its own measured loss', async () => {
    const code = `${tag}-LEARN`;
    const lotId = await createStockedLot(code, { stockGrams: 40_000 });
    await createPaidRoastedOrder({ userId: customer.id, roastDate, lines: [{ lotId, size: '1lb', quantity: 10, roastLevel: 'medium' }] });
    const listSource = async () => roastListResponseSchema.parse((await staff.get(`/api/roastery/days/${roastDate}/roast-list`)).body).lines[0]!;
    expect(await listSource()).toMatchObject({ lossSource: 'level', lossPct: 15 });

    // Three batches: 10,000 → 8,500 g (15 % loss), 10,000 → 8,400 g (16 %), 10,000 → 8,450 g (15.5 %).
    const recorded = [];
    for (const roastedGramsOut of [8_500, 8_400, 8_450]) {
      const response = await staff
        .post('/api/roastery/batches')
        .send({ roastDate, lotCode: code, roastLevel: 'medium', greenGramsIn: 10_000, roastedGramsOut });
      expect(response.status).toBe(201);
      recorded.push(batchCreatedSchema.parse(response.body));
    }
    // loss % = (in − out) ÷ in × 100 (the usual definition of roast loss).
    expect(recorded.map((batch) => batch.lossPct)).toEqual([15, 16, 15.5]);
    expect(recorded.map((batch) => batch.withinExpected)).toEqual([true, true, true]);
    expect(recorded.map((batch) => batch.lossSource)).toEqual(['level', 'level', 'lot']);
    // 40,000 g − 3 × 10,000 g = 10,000 g left.
    expect(recorded.map((batch) => batch.stockGrams)).toEqual([30_000, 20_000, 10_000]);

    const state = await lotState(lotId);
    expect(state.stockGrams).toBe(10_000);
    const roastMovements = state.movements.filter((movement) => movement.reason === 'roast');
    expect(roastMovements.map((movement) => movement.deltaGrams)).toEqual([-10_000, -10_000, -10_000]);
    expect(new Set(roastMovements.map((movement) => movement.batchId))).toEqual(new Set(recorded.map((batch) => batch.id)));
    expect(roastMovements.every((movement) => movement.actorId === staffUser.id)).toBe(true);
    // The movements still add up to the stock: 40,000 arrival − 30,000 roasted.
    expect(state.movements.reduce((total, movement) => total + movement.deltaGrams, 0)).toBe(state.stockGrams);

    // Measured loss, mass-weighted: 1 − (8,500 + 8,400 + 8,450) ÷ 30,000 = 1 − 25,350 ÷ 30,000 = 15.5 %.
    // 10 × 454 g = 4,540 g roasted: ceil(4,540 × 1.02 ÷ 0.845) = ceil(4,630.8 ÷ 0.845) = ceil(5,480.23…) = 5,481 g green.
    const line = await listSource();
    expect(line).toMatchObject({ lossSource: 'lot', lossPct: 15.5, greenGrams: 5_481, recorded: { batches: 3, greenGrams: 30_000, roastedGrams: 25_350 } });
    expect(recorded[2]!.plannedLossPct).toBe(15.5);
  });

  it('flags a loss outside the level’s range and works out the development time ratio', async () => {
    const code = `${tag}-FLAG`;
    await createStockedLot(code, { stockGrams: 5_000 });
    // 5,000 → 4,000 g is a 20 % loss, above medium's 14–16 %. First crack at 480 s of 600 s:
    // development 120 s, DTR 120 ÷ 600 = 20 % (S. Rao, "Development Time Ratio", 2016).
    const response = await staff.post('/api/roastery/batches').send({
      roastDate,
      lotCode: code,
      roastLevel: 'medium',
      greenGramsIn: 5_000,
      roastedGramsOut: 4_000,
      totalSeconds: 600,
      firstCrackSeconds: 480,
      notes: 'Ran hot after the charge.',
    });
    expect(response.status).toBe(201);
    expect(batchCreatedSchema.parse(response.body)).toMatchObject({
      lossPct: 20,
      withinExpected: false,
      lossPosition: 'above',
      expectedLossPct: { min: 14, max: 16 },
      developmentSeconds: 120,
      developmentTimeRatio: 20,
      stockGrams: 0,
    });

    const day = batchListResponseSchema.parse((await staff.get(`/api/roastery/days/${roastDate}/batches`)).body);
    const flagged = day.items.find((batch) => batch.lotCode === code);
    expect(flagged).toMatchObject({
      roastLevel: 'medium',
      greenGramsIn: 5_000,
      roastedGramsOut: 4_000,
      lossPct: 20,
      withinExpected: false,
      developmentTimeRatio: 20,
      operatorName: 'Invented Roaster',
      notes: 'Ran hot after the charge.',
    });
  });

  it('answers 409 when the lot’s stock cannot cover the green, and records nothing', async () => {
    const code = `${tag}-SHORT`;
    const lotId = await createStockedLot(code, { stockGrams: 3_000 });
    const response = await staff
      .post('/api/roastery/batches')
      .send({ roastDate, lotCode: code, roastLevel: 'dark', greenGramsIn: 3_001, roastedGramsOut: 2_450 });
    expect(response.status).toBe(409);
    const body = apiErrorSchema.parse(response.body);
    expect(body.error.code).toBe('stock_below_zero');
    expect(body.error.fields).toHaveProperty('greenGramsIn');
    const state = await lotState(lotId);
    expect(state).toMatchObject({ stockGrams: 3_000, batches: [] });
    expect(state.movements.map((movement) => movement.reason)).toEqual(['arrival']);
  });

  it.each([
    ['roasted weight not below the green', { greenGramsIn: 1_000, roastedGramsOut: 1_000 }, 'roastedGramsOut'],
    ['a loss of more than half the green', { greenGramsIn: 1_000, roastedGramsOut: 400 }, 'roastedGramsOut'],
    ['first crack after the end of the roast', { greenGramsIn: 1_000, roastedGramsOut: 850, totalSeconds: 600, firstCrackSeconds: 650 }, 'firstCrackSeconds'],
    ['a first-crack time without the total time', { greenGramsIn: 1_000, roastedGramsOut: 850, firstCrackSeconds: 480 }, 'totalSeconds'],
    ['grams that are not whole', { greenGramsIn: 1_000.5, roastedGramsOut: 850 }, 'greenGramsIn'],
    ['no roasted weight', { greenGramsIn: 1_000 }, 'roastedGramsOut'],
  ])('answers 400 naming the field for %s, and takes no stock', async (_case, weights, field) => {
    badLots += 1;
    const code = `${tag}-BAD${badLots}`;
    const lotId = await createStockedLot(code, { stockGrams: 2_000 });
    const response = await staff.post('/api/roastery/batches').send({ roastDate, lotCode: code, roastLevel: 'medium', ...weights });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty(field);
    expect(await lotState(lotId)).toMatchObject({ stockGrams: 2_000, batches: [] });
  });

  it('answers 404 naming the lot for a lot code that does not exist', async () => {
    const response = await staff
      .post('/api/roastery/batches')
      .send({ roastDate, lotCode: `${tag}-NONE`, roastLevel: 'medium', greenGramsIn: 1_000, roastedGramsOut: 850 });
    expect(response.status).toBe(404);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('lotCode');
  });

  it('records a batch once when the same request comes again with its id, at once or later', async () => {
    const code = `${tag}-RETRY`;
    const lotId = await createStockedLot(code, { stockGrams: 20_000 });
    const body = { id: randomUUID(), roastDate, lotCode: code, roastLevel: 'medium', greenGramsIn: 6_000, roastedGramsOut: 5_100 };
    const [first, racing] = await Promise.all([staff.post('/api/roastery/batches').send(body), staff.post('/api/roastery/batches').send(body)]);
    const later = await staff.post('/api/roastery/batches').send(body);
    expect([first.status, racing.status, later.status]).toEqual([201, 201, 201]);
    const replies = [first, racing, later].map((response) => batchCreatedSchema.parse(response.body));
    // 20,000 g − 6,000 g, taken once.
    expect(replies.map((reply) => [reply.id, reply.lossPct, reply.stockGrams])).toEqual(Array(3).fill([body.id, 15, 14_000]));
    const state = await lotState(lotId);
    expect(state.stockGrams).toBe(14_000);
    expect(state.batches.map((batch) => batch.id)).toEqual([body.id]);
    expect(state.movements.filter((movement) => movement.reason === 'roast')).toHaveLength(1);

    const other = await staff.post('/api/roastery/batches').send({ ...body, roastedGramsOut: 5_000 });
    expect(other.status).toBe(409);
    expect(apiErrorSchema.parse(other.body).error).toMatchObject({ code: 'batch_id_taken', fields: { id: expect.any(String) } });
    expect((await lotState(lotId)).stockGrams).toBe(14_000);
  });

  it('keeps two batches racing for the last green from taking stock below zero', async () => {
    const code = `${tag}-RACE`;
    const lotId = await createStockedLot(code, { stockGrams: 6_000 });
    const send = () => staff.post('/api/roastery/batches').send({ roastDate, lotCode: code, roastLevel: 'light', greenGramsIn: 4_000, roastedGramsOut: 3_500 });
    const statuses = (await Promise.all([send(), send()])).map((response) => response.status).sort();
    expect(statuses).toEqual([201, 409]);
    const state = await lotState(lotId);
    expect(state.stockGrams).toBe(2_000);
    expect(state.batches).toHaveLength(1);
    const [batch] = await getTestDb()
      .select()
      .from(batches)
      .where(and(eq(batches.lotId, lotId), eq(batches.roastLevel, 'light')));
    expect(batch!.greenGramsIn).toBe(4_000);
  });
});
