import { createRequire } from 'node:module';
import path from 'node:path';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { beforeAll, describe, expect, it } from 'vitest';
import { formatShopInstant } from '@shared/domain/shop-clock';
import { batchCreatedSchema, batchListResponseSchema, calendarResponseSchema, roastListResponseSchema } from '@shared/schemas/roastery';
import { shopSettingsSchema } from '@shared/schemas/settings';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import {
  createPaidRoastedOrder,
  createStockedLot,
  createTestUser,
  roastListTestSettings,
  runTag,
  saveTestShopSettings,
  type TestUser,
} from '../factories/index';

const standardFontDataUrl = `${path.join(path.dirname(createRequire(import.meta.url).resolve('pdfjs-dist/package.json')), 'standard_fonts')}/`;

// Invented data on days of this file's own (Mondays, a roast weekday here).
const tag = runTag();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: TestUser;

beforeAll(async () => {
  const app = createTestApp();
  [staff, customer] = await Promise.all([createTestUser('staff').then((user) => signedInAgent(app, user)), createTestUser('customer')]);
  await saveTestShopSettings({ ...roastListTestSettings, shipWeekdays: ['mon', 'tue', 'wed', 'thu', 'fri'] });
});

async function roastList(date: string) {
  const response = await staff.get(`/api/roastery/days/${date}/roast-list`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return roastListResponseSchema.parse(response.body);
}

async function pdfText(url: string): Promise<string> {
  const response = await staff
    .get(url)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
  expect(response.status).toBe(200);
  const pdf = await getDocument({ data: new Uint8Array(response.body as Buffer), standardFontDataUrl }).promise;
  let text = '';
  for (let number = 1; number <= pdf.numPages; number += 1) {
    const content = await (await pdf.getPage(number)).getTextContent();
    text += content.items.map((item) => ('str' in item ? item.str : '')).join(' ');
  }
  return text;
}

describe('a roast day’s Roast List is its production record', () => {
  it('keeps the lines of packed and shipped orders with their batches, and has nothing left to pull for them (JSON, CSV and PDF)', async () => {
    const date = '2031-06-02';
    const code = `${tag}-REC`;
    const lotId = await createStockedLot(code, { name: 'Invented Record Washed', stockGrams: 20_000 });
    const dates = { shipDate: '2031-06-03', readyFrom: '2031-06-04', bestBefore: '2031-06-30' };
    // 6 × 12 oz + 4 × 1 lb at medium: 6 × 341 + 4 × 454 = 3,862 g roasted (fill weights: each bag size rounded up to a whole gram).
    const first = await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      dates,
      lines: [{ lotId, size: '12oz', quantity: 6, roastLevel: 'medium' }],
    });
    const second = await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      dates,
      lines: [{ lotId, size: '1lb', quantity: 4, roastLevel: 'medium' }],
    });

    const before = await roastList(date);
    // Green: ceil(3,862 × 1.02 ÷ 0.85) = ceil(4,634.4) = 4,635 g, one batch (under the 9,600 g maximum load).
    expect(before.lines).toMatchObject([
      { lotCode: code, bags: 10, roastedGrams: 3_862, greenGrams: 4_635, toRoast: { roastedGrams: 3_862, greenGrams: 4_635 } },
    ]);
    expect(before.pull).toEqual([{ lotCode: code, lotName: 'Invented Record Washed', greenGrams: 4_635, stockGrams: 20_000, shortfallGrams: 0 }]);

    // The roaster records one batch: 4,635 g in, 3,940 g out (15.0 % loss, inside medium's 14–16 %).
    const batch = await staff
      .post('/api/roastery/batches')
      .set('X-Restday-Client', 'web')
      .send({ roastDate: date, lotCode: code, roastLevel: 'medium', greenGramsIn: 4_635, roastedGramsOut: 3_940 });
    expect(batch.status, JSON.stringify(batch.body)).toBe(201);
    batchCreatedSchema.parse(batch.body);

    // Roasted, not yet packed: the line is covered by the batch (3,940 g out ≥ 3,862 g needed).
    const roasted = await roastList(date);
    expect(roasted.lines[0]).toMatchObject({
      recorded: { batches: 1, greenGrams: 4_635, roastedGrams: 3_940 },
      toRoast: { roastedGrams: 0, greenGrams: 0, batches: [] },
    });
    expect(roasted.pull).toEqual([]);

    for (const orderId of [first, second]) {
      const packed = await staff.post(`/api/orders/${orderId}/pack`).set('X-Restday-Client', 'web').send({});
      expect(packed.status, JSON.stringify(packed.body)).toBe(200);
      const shipped = await staff
        .post(`/api/orders/${orderId}/ship`)
        .set('X-Restday-Client', 'web')
        .send({ carrier: 'Kestrel Post', trackingNumber: `9400${tag}` });
      expect(shipped.status, JSON.stringify(shipped.body)).toBe(200);
    }

    const after = await roastList(date);
    expect(after.lines).toEqual([
      {
        lotCode: code,
        lotName: 'Invented Record Washed',
        roastLevel: 'medium',
        bags: 10,
        roastedGrams: 3_862,
        lossPct: 15,
        lossSource: 'level',
        greenGrams: 4_635,
        batches: [{ greenGrams: 4_635 }],
        recorded: { batches: 1, greenGrams: 4_635, roastedGrams: 3_940 },
        toRoast: { roastedGrams: 0, greenGrams: 0, batches: [] },
      },
    ]);
    expect(after.totals).toEqual({ roastedGrams: 3_862, greenGrams: 4_635, batches: 1, toRoast: { roastedGrams: 0, greenGrams: 0, batches: 0 } });
    expect(after.pull).toEqual([]);
    // Nothing left to roast, so no load or shortfall warnings either.
    expect(after.warnings).toEqual([]);

    const csv = await staff.get(`/api/roastery/days/${date}/roast-list.csv`);
    expect(csv.status).toBe(200);
    const [header, row, ...rest] = csv.text.trim().split('\n');
    expect(header!.split(',')).toEqual(expect.arrayContaining(['recorded_batches', 'recorded_green_grams', 'recorded_roasted_grams', 'to_roast_green_grams']));
    const cells = Object.fromEntries(header!.split(',').map((column, index) => [column, row!.split(',')[index]]));
    expect(cells).toMatchObject({
      lot_code: code,
      bags: '10',
      green_grams: '4635',
      recorded_batches: '1',
      recorded_green_grams: '4635',
      recorded_roasted_grams: '3940',
      to_roast_green_grams: '0',
      lot_pull_green_grams: '0',
    });
    expect(rest).toEqual([]);

    const text = await pdfText(`/api/roastery/days/${date}/roast-list.pdf?paper=letter`);
    expect(text).toContain(code);
    expect(text).toContain('3,940 g out');
    expect(text).toContain('Done');
    expect(text).toContain('No green to pull.');
    // The printed list has room to write weights by hand, and lists the batches already recorded,
    // each at its time on the shop's clock (the zone named).
    expect(text).toMatch(/Actual\s+in\s*\/\s*out\s+\(write\s+in\)/);
    expect(text).toContain('Batches recorded');
    const [recordedBatch] = batchListResponseSchema.parse((await staff.get(`/api/roastery/days/${date}/batches`)).body).items;
    const { timeZone } = shopSettingsSchema.parse((await staff.get('/api/roastery/settings')).body);
    expect(text).toContain(formatShopInstant(recordedBatch!.createdAt, timeZone, 'time'));
    expect(text).toContain('4,635 g');

    // The Roast Calendar shows the day's record from the same batches.
    const calendar = await staff.get(`/api/roastery/calendar?from=${date}&to=${date}`);
    expect(calendar.status).toBe(200);
    expect(calendarResponseSchema.parse(calendar.body).days).toMatchObject([{ date, roasted: { batches: 1, greenGrams: 4_635, roastedGrams: 3_940 } }]);
  });

  it('plans only what the recorded batches do not cover yet, through the same loss and overage', async () => {
    const date = '2031-06-09';
    const code = `${tag}-PART`;
    const lotId = await createStockedLot(code, { stockGrams: 30_000 });
    // 20 × 1 lb at medium: 20 × 454 = 9,080 g roasted; green ceil(9,080 × 1.02 ÷ 0.85) = ceil(10,896) = 10,896 g,
    // over the 9,600 g maximum load, so two batches of 5,448 g.
    await createPaidRoastedOrder({ userId: customer.id, roastDate: date, lines: [{ lotId, size: '1lb', quantity: 20, roastLevel: 'medium' }] });
    expect((await roastList(date)).lines[0]).toMatchObject({ greenGrams: 10_896, batches: [{ greenGrams: 5_448 }, { greenGrams: 5_448 }] });

    // One batch recorded: 5,448 g in, 4,630 g out. Still to roast: 9,080 − 4,630 = 4,450 g roasted;
    // green ceil(4,450 × 1.02 ÷ 0.85) = ceil(5,340) = 5,340 g, one batch.
    const batch = await staff
      .post('/api/roastery/batches')
      .set('X-Restday-Client', 'web')
      .send({ roastDate: date, lotCode: code, roastLevel: 'medium', greenGramsIn: 5_448, roastedGramsOut: 4_630 });
    expect(batch.status, JSON.stringify(batch.body)).toBe(201);
    const list = await roastList(date);
    expect(list.lines[0]).toMatchObject({
      greenGrams: 10_896,
      recorded: { batches: 1, greenGrams: 5_448, roastedGrams: 4_630 },
      toRoast: { roastedGrams: 4_450, greenGrams: 5_340, batches: [{ greenGrams: 5_340 }] },
    });
    // Stock went down by the batch: 30,000 − 5,448 = 24,552 g; the pull is only what is left.
    expect(list.pull).toMatchObject([{ lotCode: code, greenGrams: 5_340, stockGrams: 24_552, shortfallGrams: 0 }]);
    expect(list.totals.toRoast).toEqual({ roastedGrams: 4_450, greenGrams: 5_340, batches: 1 });
  });
});
