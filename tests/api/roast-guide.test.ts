import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { lots } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';

const app = createTestApp();
const code = `GUIDE-${randomUUID().slice(0, 8)}`;

beforeAll(async () => {
  // An invented lot whose suggested level is medium.
  await getTestDb()
    .insert(lots)
    .values({
      code,
      name: 'Invented guide lot',
      origin: 'Testland',
      region: 'East Slope',
      producer: 'Invented Smallholders',
      variety: 'Typica',
      process: 'washed',
      altitudeM: 1600,
      cropYear: 2026,
      moisturePct: 10.5,
      suggestedLevel: 'medium',
      allowedLevels: ['light', 'medium'],
      stockGrams: 5000,
      pricePerKgCents: 2200,
    });
});

describe('GET /api/lots/:code/roast-guide', () => {
  it('plans a 1 lb bag for a hot-air popper at the suggested level', async () => {
    const response = await request(app).get(`/api/lots/${code}/roast-guide`).query({ device: 'popper', greenGrams: 454 });
    expect(response.status).toBe(200);
    const guide = response.body;
    expect(guide.level).toBe('medium');
    // Popper batches hold about 75–80 g of green beans (common home-roasting practice): 454 g → 6 batches.
    expect(guide.batchGrams).toEqual({ min: 75, max: 80 });
    expect(guide.batches).toBe(Math.ceil(454 / 80));
    // Medium loses 14–16% (a common rule of thumb, from memory): roasted yield between 454 × 0.84 and 454 × 0.86.
    expect(guide.expectedLossPct).toMatchObject({ min: 14, max: 16 });
    expect(guide.expectedRoastedGrams.min).toBeGreaterThanOrEqual(Math.floor(454 * 0.84));
    expect(guide.expectedRoastedGrams.max).toBeLessThanOrEqual(Math.ceil(454 * 0.86));
    // Medium: about 20–30 s after first crack in a popper (common practice).
    expect(guide.afterFirstCrackSeconds).toEqual({ min: 20, max: 30 });
    expect(guide.phases.map((phase: { name: string }) => phase.name.toLowerCase()).join(' ')).toMatch(/drying.*browning.*development/);
    expect(guide.cautions.join(' ')).toMatch(/unattended/i);
  });

  it('when the device or level is unknown, then 400 naming the field', async () => {
    const response = await request(app).get(`/api/lots/${code}/roast-guide`).query({ device: 'campfire', level: 'burnt' });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {}).sort()).toEqual(['device', 'level']);
  });

  it('when the lot is unknown, then 404', async () => {
    const response = await request(app).get('/api/lots/NO-SUCH-LOT/roast-guide');
    expect(response.status).toBe(404);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('lot_not_found');
  });
});
