import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { loadShopSettings } from '../../server/modules/settings/settings.repo';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import {
  createGreenOrder,
  createLotForSale,
  createRoastedOrder,
  createTestUser,
  saveTestShopSettings,
  testPlaceOfBusiness,
  type TestUser,
  uniqueDay,
} from '../factories/index';

const app = createTestApp();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: TestUser;

beforeAll(async () => {
  staff = await signedInAgent(app, await createTestUser('staff'));
  customer = await createTestUser('customer', { name: 'Robin Labeltest' });
  await saveTestShopSettings({ placeOfBusiness: testPlaceOfBusiness });
});

// Leave the shared test database on the defaults other test files expect.
afterAll(async () => {
  await saveTestShopSettings();
});

function binary(response: Response, done: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  response.on('data', (chunk: Buffer) => chunks.push(chunk));
  response.on('end', () => done(null, Buffer.concat(chunks)));
}

/** Each page of a PDF, as a reader extracts it (pdfjs-dist): its text and its size in points. */
async function pdfPages(pdf: Buffer): Promise<{ text: string; width: number; height: number }[]> {
  const document = await getDocument({ data: new Uint8Array(pdf), disableFontFace: true, verbosity: 0 }).promise;
  const pages: { text: string; width: number; height: number }[] = [];
  for (let n = 1; n <= document.numPages; n++) {
    const page = await document.getPage(n);
    const content = await page.getTextContent();
    const [, , width, height] = page.view as [number, number, number, number];
    pages.push({ text: content.items.map((item) => ('str' in item ? item.str : '')).join(' '), width, height });
  }
  await document.destroy();
  return pages;
}

async function labelPagesFor(date: string, stock?: string) {
  const response = await staff
    .get(`/api/roastery/days/${date}/labels.pdf${stock ? `?stock=${stock}` : ''}`)
    .buffer(true)
    .parse(binary);
  expect(response.status).toBe(200);
  expect(response.headers['content-type']).toBe('application/pdf');
  expect(response.headers['content-disposition']).toContain(`restday-labels-${date}${stock ? `-${stock}` : ''}.pdf`);
  return pdfPages(response.body as Buffer);
}

async function labelsFor(date: string) {
  return (await labelPagesFor(date)).map((page) => page.text);
}

/** The invented place of business as the label prints it, on one line. */
const printedAddress = `${testPlaceOfBusiness.line1}, ${testPlaceOfBusiness.city}, ${testPlaceOfBusiness.region} ${testPlaceOfBusiness.postalCode}, US`;

describe('GET /api/roastery/days/:date/labels.pdf', () => {
  it('prints one label per bag with its dual net weight, roast fields on roasted bags and green-coffee fields only on green bags', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    const roasted = await createRoastedOrder(customer.id, {
      roastDate,
      lines: [
        { lotId: lot.id, size: '12oz', quantity: 2, roastLevel: 'medium-dark', grind: 'french-press', brewMethod: 'filter' },
        { lotId: lot.id, size: '2lb', quantity: 1, roastLevel: 'medium-dark', grind: 'french-press', brewMethod: 'filter' },
      ],
    });
    await createGreenOrder(customer.id, lot.id, { shipDate: roasted.shipDate!, status: 'paid' });
    const { shopName } = await loadShopSettings(getTestDb());

    const pages = await labelsFor(roasted.shipDate!);

    // 3 roasted bags + 3 green bags (1 lb and 2 × 8 oz).
    expect(pages).toHaveLength(6);
    // Net weights from 1 oz = 28.349523125 g, 1 lb = 453.59237 g (NIST SP 811, App. B); label form
    // "Net Wt 12 oz (340 g)" per the FPLA and FDA 21 CFR 101.105, and from 1 lb up to 4 lb ounces first
    // with pounds in parentheses (15 U.S.C. 1453(a)(3)(A); see shared/domain/labels.test.ts for what backs it):
    //   2 lb = 32 oz = 907.185 g → 907 g; 12 oz = 340.194 g → 340 g; 1 lb = 16 oz = 453.592 g → 454 g; 8 oz = 226.796 g → 227 g.
    const roastedPages = pages.filter((page) => page.includes('Roasted:'));
    const greenPages = pages.filter((page) => page.includes('Green coffee (unroasted)'));
    expect(roastedPages).toHaveLength(3);
    expect(greenPages).toHaveLength(3);
    expect(roastedPages.filter((page) => page.includes('Net Wt 32 oz (2 lb) 907 g'))).toHaveLength(1);
    expect(roastedPages.filter((page) => page.includes('Net Wt 12 oz (340 g)'))).toHaveLength(2);
    expect(greenPages.filter((page) => page.includes('Net Wt 16 oz (1 lb) 454 g'))).toHaveLength(1);
    expect(greenPages.filter((page) => page.includes('Net Wt 8 oz (227 g)'))).toHaveLength(2);

    const dayText = (date: string) =>
      new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${date}T00:00:00Z`));
    for (const page of pages) {
      expect(page).toContain(shopName.toUpperCase());
      expect(page).toContain(printedAddress);
    }
    for (const page of roastedPages) {
      expect(page).toContain(lot.name);
      expect(page).toContain(`Lot ${lot.code}`);
      expect(page).toContain('Medium-dark');
      expect(page).toContain('French press');
      expect(page).toContain(dayText(roastDate));
      expect(page).toContain(dayText(roasted.readyFrom!));
      expect(page).toContain(dayText(roasted.bestBefore!));
    }
    for (const page of greenPages) {
      expect(page).toContain(lot.name);
      expect(page).toContain(`Lot ${lot.code}`);
      expect(page).not.toContain('Ready from');
      expect(page).not.toContain('Best before');
      expect(page).not.toContain('Roast level');
    }
  });

  it('says so on a single page when nothing ships that day', async () => {
    // A day no other test's parcel ships on (a roast day's orders ship some days after it).
    let date = uniqueDay();
    while ((await staff.get(`/api/roastery/days/${date}/pack-list`)).body.orders.length > 0) date = uniqueDay();
    const pages = await labelsFor(date);
    expect(pages).toHaveLength(1);
    expect(pages[0]).toContain('No bags ship on');
  });

  it('prints ten labels to a US Letter sheet of 4 × 2 in labels, and to an A4 sheet of 99.1 × 57 mm labels, each with the shop’s name and address', async () => {
    const lot = await createLotForSale(40_000);
    const roasted = await createRoastedOrder(customer.id, {
      roastDate: uniqueDay(),
      lines: [{ lotId: lot.id, size: '12oz', quantity: 12, roastLevel: 'light', grind: 'whole-bean', brewMethod: 'filter' }],
    });
    const { shopName } = await loadShopSettings(getTestDb());

    // 12 bags: a full sheet of 10, then 2 on the next. US Letter is 8.5 × 11 in = 612 × 792 pt and
    // A4 210 × 297 mm = 595.28 × 841.89 pt (1 in = 72 pt, PDF 32000-1 § 8.3.2.3; 1 in = 25.4 mm, NIST SP 811).
    const letter = await labelPagesFor(roasted.shipDate!, 'letter-10');
    expect(letter.map(({ width, height }) => [width, height])).toEqual([
      [612, 792],
      [612, 792],
    ]);
    const a4 = await labelPagesFor(roasted.shipDate!, 'a4-10');
    expect(a4).toHaveLength(2);
    expect(a4[0]!.width).toBeCloseTo(595.28, 1);
    expect(a4[0]!.height).toBeCloseTo(841.89, 1);
    for (const pages of [letter, a4]) {
      const count = (text: string, part: string) => text.split(part).length - 1;
      expect(pages.map((page) => count(page.text, 'Net Wt 12 oz (340 g)'))).toEqual([10, 2]);
      expect(pages.map((page) => count(page.text, printedAddress))).toEqual([10, 2]);
      expect(pages.map((page) => count(page.text, shopName.toUpperCase()))).toEqual([10, 2]);
    }
  });

  it('answers 400 naming stock for a label stock it does not know', async () => {
    const response = await staff.get(`/api/roastery/days/${uniqueDay()}/labels.pdf?stock=legal-30`);
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(['stock']);
  });

  it('answers 409 place_of_business_missing until the shop’s postal address is set', async () => {
    await saveTestShopSettings();
    try {
      const response = await staff.get(`/api/roastery/days/${uniqueDay()}/labels.pdf`);
      expect(response.status).toBe(409);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('place_of_business_missing');
    } finally {
      await saveTestShopSettings({ placeOfBusiness: testPlaceOfBusiness });
    }
  });
});
