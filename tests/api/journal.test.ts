import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { journalEntryCreatedSchema, journalListResponseSchema } from '@shared/schemas/journal';
import { lotRoastSummaryResponseSchema } from '@shared/schemas/journal-summary';
import { createGreenOrder, createLot, createTestUser, type TestUser } from '../factories/index';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';

const app = createTestApp();
type Agent = Awaited<ReturnType<typeof signedInAgent>>;

let ana: TestUser;
let anaAgent: Agent;
let benAgent: Agent;
let staffAgent: Agent;

/** The hand-worked popper roast: 80 g green → 68 g roasted, yellow 2:30, first crack 3:00, end 3:25. */
const handWorked = {
  device: 'popper',
  greenGrams: 80,
  roastedGrams: 68,
  yellowSeconds: 150,
  firstCrackSeconds: 180,
  endSeconds: 205,
  notes: 'Porch, light wind.',
};

beforeAll(async () => {
  ana = await createTestUser('customer', { name: 'Ana Journaltest' });
  anaAgent = await signedInAgent(app, ana);
  benAgent = await signedInAgent(app, await createTestUser('customer', { name: 'Ben Journaltest' }));
  staffAgent = await signedInAgent(app, await createTestUser('staff'));
});

describe('POST /api/journal', () => {
  it('works out the hand-worked popper roast: loss 15.0 %, development 25 s, DTR 12.2 %, medium', async () => {
    const lot = await createLot({ suggestedLevel: 'medium' });
    const response = await anaAgent.post('/api/journal').send({ lotCode: lot.code, ...handWorked });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const created = journalEntryCreatedSchema.parse(response.body);
    // (80 − 68) ÷ 80 = 15.0 % (arithmetic); medium loses 14–16 % (level bands, from memory).
    expect(created.lossPct).toBe(15);
    expect(created.estimatedLevel).toBe('medium');
    // Development = first crack → end: 205 − 180 = 25 s; DTR = 25 ÷ 205 = 12.195… → 12.20 % (two decimals, half up) (S. Rao, "Development Time Ratio", 2016).
    expect(created.developmentSeconds).toBe(25);
    expect(created.developmentTimeRatio).toBe(12.2);
    // A popper's medium is 20–30 s after first crack (home-roasting common practice): 25 s is inside it.
    expect(created.comparison.guide).toEqual({ afterFirstCrackSeconds: { min: 20, max: 30 }, position: 'within' });
    expect(created.comparison.levelComparedWithSuggestion).toBe('same');

    const list = journalListResponseSchema.parse((await anaAgent.get('/api/journal').query({ lotCode: lot.code })).body);
    expect(list.items).toHaveLength(1);
    expect(list.items[0]).toMatchObject({
      id: created.id,
      lotCode: lot.code,
      lossPct: 15,
      developmentSeconds: 25,
      yellowSeconds: 150,
      notes: 'Porch, light wind.',
    });
  });

  it('says how far past first crack a roast went against the guide ("45 s past … medium is 20–30 s")', async () => {
    const lot = await createLot({ suggestedLevel: 'medium' });
    // 80 g → 66 g is a 17.5 % loss, inside medium-dark's 16–18 % (level bands, from memory).
    const response = await anaAgent
      .post('/api/journal')
      .send({ lotCode: lot.code, device: 'popper', greenGrams: 80, roastedGrams: 66, firstCrackSeconds: 180, endSeconds: 225 });
    expect(response.status).toBe(201);
    const created = journalEntryCreatedSchema.parse(response.body);
    expect(created.estimatedLevel).toBe('medium-dark');
    expect(created.comparison.guide?.position).toBe('past');
    expect(created.comparison.message).toContain("You went 45 s past first crack; the guide's medium is 20–30 s.");
    expect(created.comparison.levelComparedWithSuggestion).toBe('darker');
  });

  it.each([
    ['roastedGrams', { roastedGrams: 90 }],
    ['firstCrackSeconds', { firstCrackSeconds: 240 }],
    ['yellowSeconds', { yellowSeconds: 190 }],
    ['endSeconds', { endSeconds: 'three minutes' }],
    ['device', { device: 'campfire' }],
    ['greenGrams', { greenGrams: -5 }],
    ['levelReached', { levelReached: 'burnt' }],
  ])('when %s is impossible, then 400 naming it and nothing is saved', async (field, change) => {
    const lot = await createLot();
    const response = await anaAgent.post('/api/journal').send({ lotCode: lot.code, ...handWorked, ...change });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toContain(field);
    const list = journalListResponseSchema.parse((await anaAgent.get('/api/journal').query({ lotCode: lot.code })).body);
    expect(list.items).toHaveLength(0);
  });

  it('when the lot does not exist, then 404 naming lotCode', async () => {
    const response = await anaAgent.post('/api/journal').send({ lotCode: 'NO-SUCH-LOT', ...handWorked });
    expect(response.status).toBe(404);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('lotCode');
  });

  it('when nobody is signed in, then 401', async () => {
    const response = await request(app)
      .post('/api/journal')
      .set('X-Restday-Client', 'web')
      .send({ lotCode: 'ANY', ...handWorked });
    expect(response.status).toBe(401);
  });
});

describe('GET /api/journal', () => {
  it('lists newest roast first, filters by lot and device, and offers the lots the customer bought first', async () => {
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const bought = await createLot({ name: 'Zz invented bought lot' });
    const other = await createLot();
    await createGreenOrder(customer.id, bought.id, { status: 'shipped' });
    for (const [code, roastedOn, device] of [
      [bought.code, '2026-11-02', 'popper'],
      [bought.code, '2026-11-20', 'stovetop-pan'],
      [other.code, '2026-11-10', 'popper'],
    ] as const) {
      expect((await agent.post('/api/journal').send({ ...handWorked, lotCode: code, roastedOn, device })).status).toBe(201);
    }
    const all = journalListResponseSchema.parse((await agent.get('/api/journal')).body);
    expect(all.items.map((entry) => entry.roastedOn)).toEqual(['2026-11-20', '2026-11-10', '2026-11-02']);
    expect(all.lots[0]).toEqual({ code: bought.code, name: 'Zz invented bought lot', bought: true });
    const poppers = journalListResponseSchema.parse((await agent.get('/api/journal').query({ lotCode: bought.code, device: 'popper' })).body);
    expect(poppers.items.map((entry) => entry.roastedOn)).toEqual(['2026-11-02']);
  });

  it('exports one’s own journal as CSV, and nobody else’s', async () => {
    const customer = await createTestUser('customer');
    const agent = await signedInAgent(app, customer);
    const lot = await createLot();
    await agent.post('/api/journal').send({ ...handWorked, lotCode: lot.code, notes: 'Mine, with a comma, here' });
    await benAgent.post('/api/journal').send({ ...handWorked, lotCode: lot.code, notes: 'Ben only' });
    const response = await agent.get('/api/journal.csv');
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/text\/csv/);
    const lines = response.text.trim().split('\n');
    expect(lines[0]).toMatch(/^roasted_on,lot_code,lot_name,device,green_grams,roasted_grams/);
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain('"Mine, with a comma, here"');
    expect(response.text).not.toContain('Ben only');
  });
});

describe('PUT and DELETE /api/journal/:id', () => {
  it('edits and deletes one’s own entry; another customer gets 404 and changes nothing', async () => {
    const lot = await createLot();
    const created = journalEntryCreatedSchema.parse((await anaAgent.post('/api/journal').send({ lotCode: lot.code, ...handWorked })).body);

    expect((await benAgent.put(`/api/journal/${created.id}`).send({ lotCode: lot.code, ...handWorked, roastedGrams: 70 })).status).toBe(404);
    expect((await benAgent.delete(`/api/journal/${created.id}`)).status).toBe(404);
    expect((await staffAgent.delete(`/api/journal/${created.id}`)).status).toBe(404);

    const edited = await anaAgent.put(`/api/journal/${created.id}`).send({ lotCode: lot.code, ...handWorked, roastedGrams: 70 });
    expect(edited.status).toBe(200);
    // (80 − 70) ÷ 80 = 12.5 %: light's 11–14 % (level bands, from memory).
    expect(journalEntryCreatedSchema.parse(edited.body)).toMatchObject({ id: created.id, lossPct: 12.5, estimatedLevel: 'light' });
    expect((await anaAgent.put(`/api/journal/${created.id}`).send({ lotCode: lot.code, ...handWorked, roastedGrams: 81 })).status).toBe(400);

    expect((await anaAgent.delete(`/api/journal/${created.id}`)).status).toBe(204);
    expect((await anaAgent.delete(`/api/journal/${created.id}`)).status).toBe(404);
    expect((await anaAgent.put(`/api/journal/${randomUUID()}`).send({ lotCode: lot.code, ...handWorked })).status).toBe(404);
  });
});

describe('per-lot summaries: GET /api/roastery/lots/:code/journal-summary and GET /api/lots/:code/home-roasts', () => {
  it('hide everything below 5 roasts from 3 customers, appear at it, note the disagreement, and never name a customer', async () => {
    const lot = await createLot({ suggestedLevel: 'light', allowedLevels: ['light', 'medium'] });
    const customers = await Promise.all(
      ['Cleo', 'Dara', 'Emil'].map((first) =>
        createTestUser('customer', { name: `${first} Summarytest`, email: `${first.toLowerCase()}-${randomUUID().slice(0, 8)}@example.test` }),
      ),
    );
    const agents = await Promise.all(customers.map((customer) => signedInAgent(app, customer)));
    // Every roast: 80 g → 68 g (15 %, medium by the level bands), darker than the suggested light.
    const log = (agent: Agent, endSeconds: number) => agent.post('/api/journal').send({ ...handWorked, lotCode: lot.code, firstCrackSeconds: 180, endSeconds });
    const summaries = async () => {
      const staff = lotRoastSummaryResponseSchema.parse((await staffAgent.get(`/api/roastery/lots/${lot.code}/journal-summary`)).body);
      const publicView = await request(app).get(`/api/lots/${lot.code}/home-roasts`);
      expect(publicView.status).toBe(200);
      return { staff, publicView: lotRoastSummaryResponseSchema.parse(publicView.body), text: JSON.stringify(staff) + publicView.text };
    };

    // Four roasts by three customers: one short of the minimum.
    await log(agents[0]!, 200);
    await log(agents[1]!, 210);
    await log(agents[2]!, 220);
    await log(agents[0]!, 205);
    let view = await summaries();
    expect(view.staff.summary).toBeNull();
    expect(view.publicView.summary).toBeNull();

    // The fifth roast reaches it.
    await log(agents[1]!, 215);
    view = await summaries();
    expect(view.staff.summary).toEqual({
      roasts: 5,
      customers: 3,
      medianLossPct: 15,
      // Development 20, 30, 40, 25, 35 s: the median is 30 s.
      medianDevelopmentSeconds: 30,
      levels: [{ level: 'medium', roasts: 5 }],
      disagreement: { roasts: 5, customers: 3, mostly: 'darker' },
    });
    expect(view.publicView.summary).toEqual(view.staff.summary);
    for (const customer of customers) {
      expect(view.text).not.toContain(customer.name);
      expect(view.text).not.toContain(customer.email);
      expect(view.text).not.toContain(customer.id);
    }
  });

  it('when the lot is unknown, then 404', async () => {
    expect((await staffAgent.get('/api/roastery/lots/NO-SUCH-LOT/journal-summary')).status).toBe(404);
    expect((await request(app).get('/api/lots/NO-SUCH-LOT/home-roasts')).status).toBe(404);
  });
});
