import { and, desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { defaultShopSettings, shopSettingsSchema } from '@shared/schemas/settings';
import { auditLog } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createTestUser, saveTestShopSettings, testPlaceOfBusiness, testShopSettingsBody, type TestUser } from '../factories/index';

let app: ReturnType<typeof createTestApp>;
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let ownerUser: TestUser;

async function lastSettingsAudit(actorId: string) {
  const [row] = await getTestDb()
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.action, 'settings.changed'), eq(auditLog.actorId, actorId)))
    .orderBy(desc(auditLog.at))
    .limit(1);
  return row;
}

beforeAll(async () => {
  app = createTestApp();
  ownerUser = await createTestUser('owner');
  [staff, owner] = await Promise.all([createTestUser('staff').then((user) => signedInAgent(app, user)), signedInAgent(app, ownerUser)]);
  await saveTestShopSettings();
});

// Leave the shared test database on the defaults other test files expect.
afterAll(async () => {
  await saveTestShopSettings();
});

describe('GET /api/roastery/settings', () => {
  it('shows staff the shop settings as the API shapes them', async () => {
    const response = await staff.get('/api/roastery/settings');
    expect(response.status).toBe(200);
    expect(response.headers['cache-control']).toBe('no-store');
    expect(shopSettingsSchema.parse(response.body)).toEqual(defaultShopSettings);
  });
});

describe('PUT /api/roastery/settings', () => {
  it('saves the owner’s settings, which the next read returns, and records who changed which settings', async () => {
    const changed = {
      ...testShopSettingsBody,
      timeZone: 'America/Denver',
      roastWeekdays: ['tue', 'thu'],
      overagePct: 3.5,
      roaster: { capacityGrams: 15_000, minLoadPct: 40, maxLoadPct: 85 },
    };
    const response = await owner.put('/api/roastery/settings').send(changed);
    expect(response.status).toBe(200);
    expect(shopSettingsSchema.parse(response.body)).toEqual(changed);
    expect(shopSettingsSchema.parse((await staff.get('/api/roastery/settings')).body)).toEqual(changed);
    const audit = await lastSettingsAudit(ownerUser.id);
    expect(audit?.detail).toEqual({ changed: 'timeZone,roastWeekdays,overagePct,roaster,placeOfBusiness' });
  });

  it('saves the ship policy, the weekend hold and the rest by level, and defaults them when left out', async () => {
    // Defaults: ready on arrival and no parcel over a weekend; light +1 day, medium 0,
    // medium-dark, dark and French −1 (darker roasts degas faster, Smrke et al. 2017;
    // the days from memory).
    const current = shopSettingsSchema.parse((await staff.get('/api/roastery/settings')).body);
    expect(current).toMatchObject({
      shipPolicy: 'ready_on_arrival',
      holdOverWeekend: true,
      restAdjustDays: { light: 1, medium: 0, 'medium-dark': -1, dark: -1, french: -1 },
    });

    const changed = { ...current, shipPolicy: 'after_degassing', holdOverWeekend: false, restAdjustDays: { ...current.restAdjustDays, dark: -2 } };
    const response = await owner.put('/api/roastery/settings').send(changed);
    expect(response.status).toBe(200);
    expect(shopSettingsSchema.parse((await staff.get('/api/roastery/settings')).body)).toMatchObject({
      shipPolicy: 'after_degassing',
      holdOverWeekend: false,
      restAdjustDays: { dark: -2 },
    });
    expect((await lastSettingsAudit(ownerUser.id))?.detail).toEqual({ changed: 'shipPolicy,holdOverWeekend,restAdjustDays' });

    const { shipPolicy: _policy, holdOverWeekend: _hold, ...leftOut } = changed;
    const defaulted = await owner.put('/api/roastery/settings').send(leftOut);
    expect(shopSettingsSchema.parse(defaulted.body)).toMatchObject({ shipPolicy: 'ready_on_arrival', holdOverWeekend: true });
  });

  it('answers 400 naming shipPolicy and holdOverWeekend for values they do not take, and changes nothing', async () => {
    const before = (await staff.get('/api/roastery/settings')).body as unknown;
    const response = await owner.put('/api/roastery/settings').send({ ...testShopSettingsBody, shipPolicy: 'whenever', holdOverWeekend: 'yes' });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(expect.arrayContaining(['shipPolicy', 'holdOverWeekend']));
    expect((await staff.get('/api/roastery/settings')).body).toEqual(before);
  });

  it('saves the shop’s carriers, and answers 400 naming the carrier whose tracking address is not https with {tracking}', async () => {
    // Invented carriers on reserved example domains.
    const carriers = [{ name: 'Kestrel Post', trackingUrlTemplate: 'https://track.example.com/parcel/{tracking}' }];
    const saved = await owner.put('/api/roastery/settings').send({ ...testShopSettingsBody, carriers });
    expect(saved.status).toBe(200);
    expect(shopSettingsSchema.parse((await staff.get('/api/roastery/settings')).body).carriers).toEqual(carriers);

    const before = (await staff.get('/api/roastery/settings')).body as unknown;
    const bad = await owner.put('/api/roastery/settings').send({
      ...testShopSettingsBody,
      carriers: [...carriers, { name: 'Larkspur Freight', trackingUrlTemplate: 'http://larkspur.example.net/find' }],
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {})).toContain('carriers.1.trackingUrlTemplate');
    expect((await staff.get('/api/roastery/settings')).body).toEqual(before);
    await owner.put('/api/roastery/settings').send(testShopSettingsBody).expect(200);
  });

  it('answers 400 naming each field that is wrong, and changes nothing', async () => {
    const before = (await staff.get('/api/roastery/settings')).body as unknown;
    const response = await owner.put('/api/roastery/settings').send({
      ...testShopSettingsBody,
      timeZone: 'Mars/Olympus_Mons',
      cutoff: { time: '25:00', daysBefore: 1 },
      roaster: { capacityGrams: 12_000, minLoadPct: 90, maxLoadPct: 80 },
    });
    expect(response.status).toBe(400);
    const fields = apiErrorSchema.parse(response.body).error.fields ?? {};
    expect(Object.keys(fields)).toEqual(expect.arrayContaining(['timeZone', 'cutoff.time', 'roaster.minLoadPct']));
    expect((await staff.get('/api/roastery/settings')).body).toEqual(before);
  });

  it('answers 400 naming placeOfBusiness when the shop’s postal address is left out or null, and changes nothing', async () => {
    const before = (await staff.get('/api/roastery/settings')).body as unknown;
    const { placeOfBusiness: _address, ...withoutAddress } = testShopSettingsBody;
    for (const body of [withoutAddress, { ...testShopSettingsBody, placeOfBusiness: null }]) {
      const response = await owner.put('/api/roastery/settings').send(body);
      expect(response.status).toBe(400);
      expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(['placeOfBusiness']);
    }
    expect((await staff.get('/api/roastery/settings')).body).toEqual(before);
  });

  it('answers 400 naming each blank line of the place of business, and changes nothing', async () => {
    const before = (await staff.get('/api/roastery/settings')).body as unknown;
    const response = await owner
      .put('/api/roastery/settings')
      .send({ ...testShopSettingsBody, placeOfBusiness: { ...testPlaceOfBusiness, line1: ' ', postalCode: '', country: 'USA' } });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {}).sort()).toEqual([
      'placeOfBusiness.country',
      'placeOfBusiness.line1',
      'placeOfBusiness.postalCode',
    ]);
    expect((await staff.get('/api/roastery/settings')).body).toEqual(before);
  });

  it('is the owner’s alone: staff get 403 and the settings stay as they were', async () => {
    const before = (await staff.get('/api/roastery/settings')).body as unknown;
    const response = await staff.put('/api/roastery/settings').send({ ...testShopSettingsBody, overagePct: 9 });
    expect(response.status).toBe(403);
    expect((await staff.get('/api/roastery/settings')).body).toEqual(before);
  });
});
