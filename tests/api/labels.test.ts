import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { Response } from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { loadShopSettings } from '../../server/modules/settings/settings.repo';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createGreenOrder, createLotForSale, createRoastedOrder, createTestUser, type TestUser, uniqueDay } from '../factories/index';

const app = createTestApp();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: TestUser;

beforeAll(async () => {
  staff = await signedInAgent(app, await createTestUser('staff'));
  customer = await createTestUser('customer', { name: 'Robin Labeltest' });
});

function binary(response: Response, done: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  response.on('data', (chunk: Buffer) => chunks.push(chunk));
  response.on('end', () => done(null, Buffer.concat(chunks)));
}

/** The text on each page of a PDF, as a reader extracts it (pdfjs-dist). */
async function pageTexts(pdf: Buffer): Promise<string[]> {
  const document = await getDocument({ data: new Uint8Array(pdf), disableFontFace: true, verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let n = 1; n <= document.numPages; n++) {
    const content = await (await document.getPage(n)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await document.destroy();
  return pages;
}

async function labelsFor(date: string) {
  const response = await staff.get(`/api/roastery/days/${date}/labels.pdf`).buffer(true).parse(binary);
  expect(response.status).toBe(200);
  expect(response.headers['content-type']).toBe('application/pdf');
  expect(response.headers['content-disposition']).toContain(`restday-labels-${date}.pdf`);
  return pageTexts(response.body as Buffer);
}

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
    for (const page of roastedPages) {
      expect(page).toContain(shopName.toUpperCase());
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
    const date = uniqueDay();
    const pages = await labelsFor(date);
    expect(pages).toHaveLength(1);
    expect(pages[0]).toContain('No bags ship on');
  });
});
