import { count, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { quoteGreenOrder } from '@shared/domain/pricing';
import { apiErrorSchema } from '@shared/schemas/errors';
import { greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { lotDetailSchema } from '@shared/schemas/lots';
import { defaultShopSettings } from '@shared/schemas/settings';
import { shippingRulesSchema } from '@shared/schemas/shipping';
import { orders } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { orderRow } from './payments-support';
import { createLotForSale, createTestUser, saveTestShopSettings, shipTo, testShopSettingsBody, type TestUser } from '../factories/index';

const app = createTestApp();
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let customer: TestUser;
let shopper: Awaited<ReturnType<typeof signedInAgent>>;

// Invented bands for the owner to set: ≤ 3 kg $9.00, ≤ 6 kg $15.00; bag tare 30 g, box tare 250 g.
const editedShipping = {
  bands: [
    { maxGrams: 3000, cents: 900 },
    { maxGrams: 6000, cents: 1500 },
  ],
  bagTareGrams: 30,
  boxTareGrams: 250,
};

beforeAll(async () => {
  await saveTestShopSettings();
  owner = await signedInAgent(app, await createTestUser('owner'));
  customer = await createTestUser('customer');
  shopper = await signedInAgent(app, customer);
});

// Leave the shared test database on the defaults other test files expect.
afterAll(async () => {
  await saveTestShopSettings();
});

async function putShipping(shipping: typeof editedShipping) {
  const response = await owner.put('/api/roastery/settings').send({ ...testShopSettingsBody, shipping });
  expect(response.status, JSON.stringify(response.body)).toBe(200);
}

async function ordersOf(userId: string) {
  const [row] = await getTestDb().select({ n: count() }).from(orders).where(eq(orders.userId, userId));
  return row!.n;
}

describe('GET /api/shipping', () => {
  it('gives anyone the shop’s bands, tares and currency, revalidated by ETag so an owner’s edit shows at once', async () => {
    const first = await request(app).get('/api/shipping');
    expect(first.status).toBe(200);
    expect(shippingRulesSchema.parse(first.body)).toEqual({ currency: 'usd', ...defaultShopSettings.shipping });
    expect(first.headers['cache-control']).toBe('public, no-cache');
    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^"[\w-]+"$/);
    expect((await request(app).get('/api/shipping').set('If-None-Match', etag)).status).toBe(304);

    await putShipping(editedShipping);

    const edited = await request(app).get('/api/shipping').set('If-None-Match', etag);
    expect(edited.status).toBe(200);
    expect(shippingRulesSchema.parse(edited.body)).toEqual({ currency: 'usd', ...editedShipping });
    expect(edited.headers.etag).not.toBe(etag);
    await saveTestShopSettings();
  });
});

describe('the cart’s quote and the green checkout’s charge', () => {
  it('agree after the owner edits the bands', async () => {
    const lot = await createLotForSale(20_000);
    await putShipping(editedShipping);

    // What the cart does: the lot's prices and GET /api/shipping, priced by the shared trade engine.
    const detail = lotDetailSchema.parse((await request(app).get(`/api/lots/${lot.code}`)).body);
    const rules = shippingRulesSchema.parse((await request(app).get('/api/shipping')).body);
    const items = [{ lotCode: lot.code, size: '5lb' as const, quantity: 3 }];
    const cartQuote = quoteGreenOrder(items, { [lot.code]: detail }, { shipping: rules });

    // Hand-worked on the edited bands: a 5 lb bag packed is 2,268 (5 lb rounded up to a whole gram) + 30 = 2,298 g. The 3 kg band
    // leaves 3,000 − 250 = 2,750 g (1 bag), the 6 kg band 5,750 g (2 bags, 4,596 g). 3 bags: 2 + 1 →
    // 4,846 g ($15.00) + 2,548 g ($9.00) = $24.00 (1 + 1 + 1 would be $27.00).
    // Bags: $40.00/kg × 2.26796185 kg (NIST SP 811) = $90.718… → $90.72; 3 × $90.72 = $272.16. Total $296.16.
    expect(cartQuote.shippingCents).toBe(2400);
    expect(cartQuote.totalCents).toBe(29_616);

    const response = await shopper.post('/api/checkout/green').send({ items, shippingAddress: shipTo });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const row = await orderRow(greenCheckoutResponseSchema.parse(response.body).orderId);
    expect(row.shippingCents).toBe(cartQuote.shippingCents);
    expect(row.totalCents).toBe(cartQuote.totalCents);
    await saveTestShopSettings();
  });

  it('answers 422 too_heavy_to_ship on the size when one bag is over the heaviest band, and places nothing', async () => {
    const lot = await createLotForSale(20_000);
    // 5 lb packed alone: 2,268 + 20 + 180 = 2,468 g, over a 2 kg top band.
    await putShipping({ bands: [{ maxGrams: 2000, cents: 1195 }], bagTareGrams: 20, boxTareGrams: 180 });
    const before = await ordersOf(customer.id);

    const response = await shopper.post('/api/checkout/green').send({
      items: [
        { lotCode: lot.code, size: '1lb', quantity: 1 },
        { lotCode: lot.code, size: '5lb', quantity: 1 },
      ],
      shippingAddress: shipTo,
    });

    expect(response.status).toBe(422);
    const { error } = apiErrorSchema.parse(response.body);
    expect(error.code).toBe('too_heavy_to_ship');
    expect(Object.keys(error.fields ?? {})).toEqual(['items.1.size']);
    expect(error.fields?.['items.1.size']).toContain('2,468 g');
    expect(await ordersOf(customer.id)).toBe(before);
    await saveTestShopSettings();
  });

  it('answers 422 on bagSize when a subscription’s roasted bag is over the heaviest band', async () => {
    // 2 lb roasted packed alone: 908 (2 lb rounded up to a whole gram) + 20 + 180 = 1,108 g, over a 1 kg top band.
    await putShipping({ bands: [{ maxGrams: 1000, cents: 895 }], bagTareGrams: 20, boxTareGrams: 180 });
    const query = { roastLevel: 'medium', bagsPerDelivery: '1', brewMethod: 'filter', cadenceWeeks: '2' };

    const response = await request(app)
      .get('/api/subscriptions/preview')
      .query({ ...query, bagSize: '2lb' });

    expect(response.status).toBe(422);
    const { error } = apiErrorSchema.parse(response.body);
    expect(error.code).toBe('too_heavy_to_ship');
    expect(Object.keys(error.fields ?? {})).toEqual(['bagSize']);
    // 12 oz: 341 + 20 + 180 = 541 g still ships in the 1 kg band.
    expect(
      (
        await request(app)
          .get('/api/subscriptions/preview')
          .query({ ...query, bagSize: '12oz' })
      ).status,
    ).toBe(200);
    await saveTestShopSettings();
  });
});
