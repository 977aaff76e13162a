import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { lotDetailSchema, lotListResponseSchema } from '@shared/schemas/lots';
import { lotPriceBreaks, lots, uploads } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';

// Invented test lots; a run-unique tag keeps them apart from other files' rows.
const tag = randomUUID().slice(0, 8).toUpperCase();
const app = createTestApp();

type NewLot = typeof lots.$inferInsert;
function lotRow(overrides: Partial<NewLot> & Pick<NewLot, 'code'>): NewLot {
  return {
    name: `Test lot ${overrides.code}`,
    origin: 'Testland',
    region: 'North Ridge',
    producer: 'Invented Growers Cooperative',
    variety: 'Bourbon',
    process: 'washed',
    altitudeM: 1700,
    cropYear: 2026,
    moisturePct: 10.8,
    suggestedLevel: 'medium',
    allowedLevels: ['light', 'medium', 'medium-dark'],
    stockGrams: 10_000,
    pricePerKgCents: 2400,
    tastingNotes: ['plum', 'cocoa'],
    ...overrides,
  };
}

beforeAll(async () => {
  const db = getTestDb();
  const inserted = await db
    .insert(lots)
    .values([
      lotRow({ code: `${tag}-A`, origin: `Tagland ${tag}`, process: 'natural', suggestedLevel: 'light', tastingNotes: ['blueberry', 'jasmine'] }),
      lotRow({ code: `${tag}-B`, origin: `Tagland ${tag}`, stockGrams: 0 }),
      lotRow({ code: `${tag}-C`, origin: `Tagland ${tag}`, stockGrams: 226 }),
      lotRow({ code: `${tag}-D`, origin: `Tagland ${tag}`, isListed: false }),
    ])
    .returning({ id: lots.id, code: lots.code });
  await db
    .insert(lots)
    .values([
      lotRow({ code: `${tag}-P1`, name: 'Cedar', origin: `Priceland ${tag}`, pricePerKgCents: 1800, altitudeM: 1400, cropYear: 2025 }),
      lotRow({ code: `${tag}-P2`, name: 'Alder', origin: `Priceland ${tag}`, pricePerKgCents: 2205, altitudeM: 2100, cropYear: 2026 }),
      lotRow({ code: `${tag}-P3`, name: 'Birch', origin: `Priceland ${tag}`, pricePerKgCents: 3100, altitudeM: 1750, cropYear: 2024 }),
    ]);
  const lotA = inserted.find((lot) => lot.code === `${tag}-A`)!;
  await db.insert(lotPriceBreaks).values([
    { lotId: lotA.id, minGrams: 9072, pricePerKgCents: 2000 },
    { lotId: lotA.id, minGrams: 2268, pricePerKgCents: 2200 },
  ]);
  await db.insert(uploads).values([
    { lotId: lotA.id, kind: 'photo', storageKey: `${tag}-2.webp`, contentType: 'image/webp', byteSize: 10, originalName: 'b.webp', position: 2 },
    { lotId: lotA.id, kind: 'photo', storageKey: `${tag}-1.webp`, contentType: 'image/webp', byteSize: 10, originalName: 'a.webp', position: 1 },
    { lotId: lotA.id, kind: 'spec_sheet', storageKey: `${tag}.pdf`, contentType: 'application/pdf', byteSize: 10, originalName: 'spec.pdf', position: 0 },
  ]);
});

async function listCodes(query: Record<string, string>) {
  const response = await request(app)
    .get('/api/lots')
    .query({ origin: `Tagland ${tag}`, ...query });
  expect(response.status).toBe(200);
  return lotListResponseSchema
    .parse(response.body)
    .items.map((item) => item.code)
    .sort();
}

describe('GET /api/lots', () => {
  it('lists listed lots in the contract shape and hides unlisted ones', async () => {
    expect(await listCodes({})).toEqual([`${tag}-A`, `${tag}-B`, `${tag}-C`]);
  });

  it('filters by process, suggested level and free text over tasting notes', async () => {
    expect(await listCodes({ process: 'natural' })).toEqual([`${tag}-A`]);
    expect(await listCodes({ level: 'light' })).toEqual([`${tag}-A`]);
    expect(await listCodes({ q: 'JASMINE' })).toEqual([`${tag}-A`]);
  });

  it('treats a lot as in stock only while it can fill the smallest bag (8 oz → 227 g, rounded up)', async () => {
    expect(await listCodes({ inStock: 'true' })).toEqual([`${tag}-A`]);
  });

  it('matches origin without regard to case and escapes LIKE wildcards in search', async () => {
    expect(await listCodes({ origin: `tagland ${tag.toLowerCase()}` })).toHaveLength(3);
    expect(await listCodes({ q: '%' })).toEqual([]);
  });

  it('lets browsers and shared caches keep the list for 10 s, and answers a revalidation with 304', async () => {
    const first = await request(app)
      .get('/api/lots')
      .query({ origin: `Tagland ${tag}` });
    expect(first.headers['cache-control']).toBe('public, max-age=10');
    expect(first.headers.etag).toBeTruthy();
    const again = await request(app)
      .get('/api/lots')
      .query({ origin: `Tagland ${tag}` })
      .set('If-None-Match', first.headers.etag!);
    expect(again.status).toBe(304);
  });

  it('gives each card its first photo by position', async () => {
    const response = await request(app)
      .get('/api/lots')
      .query({ q: `${tag}-A` });
    const [lot] = lotListResponseSchema.parse(response.body).items;
    expect(lot?.photoUrl).toMatch(/^\/api\/uploads\/[0-9a-f-]{36}$/);
  });

  it('when a filter is not one of the allowed values, then 400 naming the field', async () => {
    const response = await request(app).get('/api/lots').query({ level: 'charcoal', inStock: 'maybe' });
    expect(response.status).toBe(400);
    const body = apiErrorSchema.parse(response.body);
    expect(body.error.code).toBe('invalid_input');
    expect(Object.keys(body.error.fields ?? {}).sort()).toEqual(['inStock', 'level']);
  });
});

describe('GET /api/lots — price range and sort', () => {
  async function listInOrder(query: Record<string, string>) {
    const response = await request(app)
      .get('/api/lots')
      .query({ origin: `Priceland ${tag}`, ...query });
    expect(response.status).toBe(200);
    return lotListResponseSchema.parse(response.body).items.map((item) => item.code.slice(-2));
  }

  it('keeps lots whose list price per kg lies within the bounds, both ends included', async () => {
    expect(await listInOrder({ minPricePerKgCents: '2205', sort: 'price-asc' })).toEqual(['P2', 'P3']);
    expect(await listInOrder({ maxPricePerKgCents: '2205', sort: 'price-asc' })).toEqual(['P1', 'P2']);
    expect(await listInOrder({ minPricePerKgCents: '2000', maxPricePerKgCents: '3000' })).toEqual(['P2']);
    expect(await listInOrder({ minPricePerKgCents: '3101' })).toEqual([]);
  });

  it('sorts by name, price either way, newest crop and highest altitude', async () => {
    expect(await listInOrder({ sort: 'name' })).toEqual(['P2', 'P3', 'P1']);
    expect(await listInOrder({ sort: 'price-asc' })).toEqual(['P1', 'P2', 'P3']);
    expect(await listInOrder({ sort: 'price-desc' })).toEqual(['P3', 'P2', 'P1']);
    expect(await listInOrder({ sort: 'newest' })).toEqual(['P2', 'P1', 'P3']);
    expect(await listInOrder({ sort: 'altitude' })).toEqual(['P2', 'P3', 'P1']);
  });

  it('when the minimum price is above the maximum, then 400 naming minPricePerKgCents', async () => {
    const response = await request(app).get('/api/lots').query({ minPricePerKgCents: '3000', maxPricePerKgCents: '2000' });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toEqual({ minPricePerKgCents: 'must not be more than maxPricePerKgCents' });
  });

  it('when a price bound is not whole cents or the sort is unknown, then 400 naming each field', async () => {
    const response = await request(app).get('/api/lots').query({ minPricePerKgCents: '12.5', maxPricePerKgCents: 'cheap', sort: 'random' });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {}).sort()).toEqual(['maxPricePerKgCents', 'minPricePerKgCents', 'sort']);
  });
});

describe('GET /api/lots/:code', () => {
  it('returns every descriptor with price breaks ascending, photos in order and the spec sheet', async () => {
    const response = await request(app).get(`/api/lots/${tag}-A`);
    expect(response.status).toBe(200);
    const lot = lotDetailSchema.parse(response.body);
    expect(lot).toMatchObject({ code: `${tag}-A`, process: 'natural', moisturePct: 10.8, allowedLevels: ['light', 'medium', 'medium-dark'] });
    expect(lot.priceBreaks.map((priceBreak) => priceBreak.minGrams)).toEqual([2268, 9072]);
    expect(lot.photos).toHaveLength(2);
    expect(lot.specSheetUrl).toMatch(/^\/api\/uploads\//);
  });

  it('when the lot does not exist or is unlisted, then 404 with the error shape', async () => {
    for (const code of [`${tag}-ZZ`, `${tag}-D`]) {
      const response = await request(app).get(`/api/lots/${code}`);
      expect(response.status).toBe(404);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('lot_not_found');
    }
  });
});
