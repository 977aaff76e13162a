import { createRequire } from 'node:module';
import path from 'node:path';
import request from 'supertest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { beforeAll, describe, expect, it } from 'vitest';
import { roastListResponseSchema } from '@shared/schemas/roastery';
import { apiErrorSchema } from '@shared/schemas/errors';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import {
  createPaidRoastedOrder,
  createStockedLot,
  createTestUser,
  pickRotationLot,
  roastListTestSettings,
  runTag,
  saveTestShopSettings,
  type TestUser,
} from '../factories/index';

// pdf.js reads the standard fonts' metrics from its own package.
const standardFontDataUrl = `${path.join(path.dirname(createRequire(import.meta.url).resolve('pdfjs-dist/package.json')), 'standard_fonts')}/`;

// Invented data; dates of their own (a Wednesday, a roast weekday by default) keep other files' orders off these lists.
const tag = runTag();
let app: ReturnType<typeof createTestApp>;
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: TestUser;

beforeAll(async () => {
  app = createTestApp();
  [staff, customer] = await Promise.all([createTestUser('staff').then((user) => signedInAgent(app, user)), createTestUser('customer')]);
  await saveTestShopSettings(roastListTestSettings);
});

describe('GET /api/roastery/days/:date/roast-list', () => {
  it('plans one lot at medium exactly as worked by hand: 3,862 g roasted → 4,635 g green in one batch below the preferred load', async () => {
    const date = '2031-03-05';
    const code = `${tag}-ONE`;
    const lotId = await createStockedLot(code, { name: 'Invented Hollow Washed', stockGrams: 10_000 });
    // 6 bags of 12 oz and 4 of 1 lb, spread over three orders.
    await createPaidRoastedOrder({ userId: customer.id, roastDate: date, lines: [{ lotId, size: '12oz', quantity: 4, roastLevel: 'medium' }] });
    await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      status: 'held',
      lines: [
        { lotId, size: '12oz', quantity: 2, roastLevel: 'medium' },
        { lotId, size: '1lb', quantity: 1, roastLevel: 'medium' },
      ],
    });
    await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      lines: [{ lotId, size: '1lb', quantity: 3, roastLevel: 'medium', brewMethod: 'espresso' }],
    });
    // Not on the list: unpaid, cancelled, another day.
    await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      status: 'pending_payment',
      lines: [{ lotId, size: '2lb', quantity: 5, roastLevel: 'medium' }],
    });
    await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      status: 'cancelled',
      lines: [{ lotId, size: '2lb', quantity: 5, roastLevel: 'medium' }],
    });
    await createPaidRoastedOrder({ userId: customer.id, roastDate: '2031-03-07', lines: [{ lotId, size: '2lb', quantity: 5, roastLevel: 'medium' }] });

    const response = await staff.get(`/api/roastery/days/${date}/roast-list`);
    expect(response.status).toBe(200);
    const list = roastListResponseSchema.parse(response.body);

    // Fill weights (each declared weight rounded up to a whole gram): 12 oz → 341 g, 1 lb → 454 g.
    // Roasted: 6 × 341 + 4 × 454 = 2,046 + 1,816 = 3,862 g.
    // Green: ceil(3,862 × 1.02 ÷ (1 − 0.15)) = ceil(3,939.24 ÷ 0.85) = ceil(4,634.4) = 4,635 g
    //   (green = roasted ÷ (1 − loss), common practice; plus the 2 % overage).
    // Batches: the maximum load is 80 % of 12,000 = 9,600 g, so 4,635 g is one batch; the preferred
    //   minimum is 50 % of 12,000 = 6,000 g, so it is below it (warning); the hard floor is 25 % of
    //   12,000 = 3,000 g (under 25 % is hard to control, S. Rao 2014), so no floor proposal.
    expect(list.lines).toEqual([
      {
        lotCode: code,
        lotName: 'Invented Hollow Washed',
        roastLevel: 'medium',
        bags: 10,
        roastedGrams: 3_862,
        lossPct: 15,
        lossSource: 'level',
        greenGrams: 4_635,
        batches: [{ greenGrams: 4_635 }],
        recorded: { batches: 0, greenGrams: 0, roastedGrams: 0 },
        // Nothing roasted yet: all of it is still to roast.
        toRoast: { roastedGrams: 3_862, greenGrams: 4_635, batches: [{ greenGrams: 4_635 }] },
      },
    ]);
    expect(list.totals).toEqual({ roastedGrams: 3_862, greenGrams: 4_635, batches: 1, toRoast: { roastedGrams: 3_862, greenGrams: 4_635, batches: 1 } });
    // 10,000 g in stock − 4,635 g to pull: nothing short.
    expect(list.pull).toEqual([{ lotCode: code, lotName: 'Invented Hollow Washed', greenGrams: 4_635, stockGrams: 10_000, shortfallGrams: 0 }]);
    expect(list.day).toEqual({ open: true, capacityGrams: 60_000 });
    expect(list.warnings.map((warning) => warning.code)).toEqual(['below_preferred_load']);
    expect(list.warnings[0]).toMatchObject({ lotCode: code, roastLevel: 'medium' });
    expect(list.warnings[0]!.message).toContain('6,000 g');
  });

  it("puts Roaster's Rotation bags on the day's picked lot, and warns about rotation bags on a day with no pick", async () => {
    const picked = '2031-03-10';
    const unpicked = '2031-03-12';
    const code = `${tag}-ROT`;
    const lotId = await createStockedLot(code, { stockGrams: 1_000 });
    await pickRotationLot(picked, lotId);
    await createPaidRoastedOrder({ userId: customer.id, roastDate: picked, lines: [{ lotId: null, size: '2lb', quantity: 2, roastLevel: 'dark' }] });
    await createPaidRoastedOrder({ userId: customer.id, roastDate: unpicked, lines: [{ lotId: null, size: '12oz', quantity: 3, roastLevel: 'light' }] });

    const withPick = roastListResponseSchema.parse((await staff.get(`/api/roastery/days/${picked}/roast-list`)).body);
    // 2 × 908 g (2 lb fill) = 1,816 g roasted at dark, 19 % (from memory):
    // ceil(1,816 × 1.02 ÷ 0.81) = ceil(1,852.32 ÷ 0.81) = ceil(2,286.81…) = 2,287 g green.
    expect(withPick.lines).toMatchObject([{ lotCode: code, roastLevel: 'dark', roastedGrams: 1_816, greenGrams: 2_287 }]);
    // 2,287 g needed, 1,000 g in stock: 1,287 g short.
    expect(withPick.pull).toEqual([{ lotCode: code, lotName: `Invented lot ${code}`, greenGrams: 2_287, stockGrams: 1_000, shortfallGrams: 1_287 }]);
    const codes = withPick.warnings.map((warning) => warning.code);
    expect(codes).toContain('green_shortfall');
    // 2,287 g is under a quarter of 12,000 g (3,000 g): below the hard floor, with a proposal to raise it.
    expect(codes).toContain('below_minimum_load');
    expect(withPick.lines[0]!.floorProposal).toMatchObject({ batchGreenGrams: 3_000, extraGreenGrams: 713 });

    const withoutPick = roastListResponseSchema.parse((await staff.get(`/api/roastery/days/${unpicked}/roast-list`)).body);
    expect(withoutPick.lines).toEqual([]);
    expect(withoutPick.warnings).toEqual([
      expect.objectContaining({ code: 'rotation_not_picked', roastLevel: 'light', message: expect.stringContaining('3 bags') }),
    ]);
  });

  it('warns when the day plans more green than its capacity', async () => {
    const date = '2031-03-14';
    const lotId = await createStockedLot(`${tag}-BIG`, { stockGrams: 100_000 });
    await saveTestShopSettings({ dayCapacityGrams: 10_000, roaster: { capacityGrams: 12_000, minLoadPct: 50, maxLoadPct: 80 }, overagePct: 2 });
    try {
      // 30 × 454 g = 13,620 g roasted at medium 15 %: ceil(13,620 × 1.02 ÷ 0.85) = ceil(16,344) = 16,344 g green, over 10,000 g.
      await createPaidRoastedOrder({ userId: customer.id, roastDate: date, lines: [{ lotId, size: '1lb', quantity: 30, roastLevel: 'medium' }] });
      const list = roastListResponseSchema.parse((await staff.get(`/api/roastery/days/${date}/roast-list`)).body);
      expect(list.totals.greenGrams).toBe(16_344);
      // 16,344 g over a 9,600 g maximum load: two batches of 8,172 g.
      expect(list.lines[0]!.batches).toEqual([{ greenGrams: 8_172 }, { greenGrams: 8_172 }]);
      expect(list.warnings[0]).toMatchObject({ code: 'over_day_capacity', message: expect.stringContaining('6,344 g over') });
    } finally {
      await saveTestShopSettings({ dayCapacityGrams: 60_000 });
    }
  });

  it('answers 400 naming the date for a date that is not one', async () => {
    const response = await staff.get('/api/roastery/days/2031-02-30/roast-list');
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('date');
  });

  it('is for staff only: a customer gets 403 and nothing else', async () => {
    const customerAgent = await signedInAgent(app, customer);
    expect((await customerAgent.get('/api/roastery/days/2031-03-05/roast-list')).status).toBe(403);
    expect((await request(app).get('/api/roastery/days/2031-03-05/roast-list')).status).toBe(401);
  });
});

describe('GET /api/roastery/days/:date/roast-list.csv and .pdf', () => {
  const date = '2031-03-17';
  let code: string;

  beforeAll(async () => {
    code = `${tag}-DOC`;
    const lotId = await createStockedLot(code, { name: '=HYPERLINK("http://invalid.example")', stockGrams: 20_000 });
    await createPaidRoastedOrder({
      userId: customer.id,
      roastDate: date,
      lines: [
        { lotId, size: '12oz', quantity: 6, roastLevel: 'medium' },
        { lotId, size: '1lb', quantity: 4, roastLevel: 'medium' },
      ],
    });
  });

  it('downloads the list as CSV, one row per lot and level, with text that could run as a formula kept as text', async () => {
    const response = await staff.get(`/api/roastery/days/${date}/roast-list.csv`);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/^text\/csv/);
    expect(response.headers['content-disposition']).toBe(`attachment; filename=roast-list-${date}.csv`);
    const [header, row, ...rest] = response.text.trim().split('\n');
    expect(header).toBe(
      'roast_date,lot_code,lot_name,roast_level,bags,roasted_grams,loss_pct,loss_source,green_grams,batch_count,batch_green_grams,recorded_batches,recorded_green_grams,recorded_roasted_grams,to_roast_roasted_grams,to_roast_green_grams,to_roast_batch_green_grams,lot_pull_green_grams,lot_stock_grams,lot_shortfall_grams',
    );
    // The same hand-worked figures as above: 3,862 g roasted, 4,635 g green, one batch, nothing recorded yet.
    expect(row).toBe(`${date},${code},"'=HYPERLINK(""http://invalid.example"")",medium,10,3862,15,level,4635,1,4635,0,0,0,3862,4635,4635,4635,20000,0`);
    expect(rest).toEqual([]);
  });

  it('prints the list as a PDF with the shop, the date, the lines, the pull list and the roasting cautions', async () => {
    const response = await staff
      .get(`/api/roastery/days/${date}/roast-list.pdf?paper=a4`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    const pdf = await getDocument({ data: new Uint8Array(response.body as Buffer), standardFontDataUrl }).promise;
    const page = await pdf.getPage(1);
    // A4 is 595 × 842 points.
    expect(page.view.map(Math.round)).toEqual([0, 0, 595, 842]);
    let text = '';
    for (let number = 1; number <= pdf.numPages; number += 1) {
      const content = await (await pdf.getPage(number)).getTextContent();
      text += content.items.map((item) => ('str' in item ? item.str : '')).join(' ');
    }
    expect(text).toContain('Invented Test Roastery');
    expect(text).toContain('Monday, March 17, 2031');
    expect(text).toContain(code);
    expect(text).toContain('4,635 g');
    expect(text).toContain('Pull list');
    expect(text).toContain('Carbon monoxide');
    expect(text).toContain('licensed installers');
  });

  it('answers 400 naming paper for a paper size it does not print', async () => {
    const response = await staff.get(`/api/roastery/days/${date}/roast-list.pdf?paper=tabloid`);
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('paper');
  });
});
