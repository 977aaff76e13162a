import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { createLotForSale, createTestUser, shipTo } from '../factories/index';

// Each case was a 500 (or a frozen event loop) before: found by fuzzing every route with bad input.
const app = createTestApp();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  [staff, customer] = await Promise.all([
    createTestUser('staff').then((user) => signedInAgent(app, user)),
    createTestUser('customer').then((user) => signedInAgent(app, user)),
  ]);
});

function expectBadInput(response: request.Response, field: string) {
  expect(response.status, JSON.stringify(response.body)).toBe(400);
  const { error } = apiErrorSchema.parse(response.body);
  expect(error.fields, JSON.stringify(error)).toHaveProperty([field]);
}

describe('text PostgreSQL cannot store answers 400 naming the field', () => {
  it('a NUL in a path parameter or a query', async () => {
    expectBadInput(await request(app).get('/api/lots/%00'), 'path');
    expectBadInput(await request(app).get('/api/lots?q=%00'), 'q');
  });

  it('a NUL in a JSON field, nested or not, and nothing is created', async () => {
    const email = `nul-${randomUUID().slice(0, 8)}@example.test`;
    const response = await request(app)
      .post('/api/auth/sign-up')
      .set('X-Restday-Client', 'web')
      .send({ email, password: 'a long invented passphrase', name: 'Robin\u0000Tester' });
    expectBadInput(response, 'name');
    const signIn = await request(app).post('/api/auth/sign-in').set('X-Restday-Client', 'web').send({ email, password: 'a long invented passphrase' });
    expect(signIn.status).toBe(401);
  });

  it('a lone surrogate in a shipping address', async () => {
    const lot = await createLotForSale(5_000);
    const response = await customer
      .post('/api/checkout/green')
      .send({ items: [{ lotCode: lot.code, size: '1lb', quantity: 1 }], shippingAddress: { ...shipTo, line1: '4 Larkspur \ud800Lane' } });
    expectBadInput(response, 'shippingAddress.line1');
  });
});

describe('dates that do not exist, or lie far outside the shop’s years, answer 400 at once', () => {
  it('an impossible day in a range query', async () => {
    expectBadInput(await staff.get('/api/roastery/calendar?from=2026-02-30&to=2027-01-01'), 'from');
    expectBadInput(await staff.get('/api/roastery/rotation?from=2026-02-30&to=2026-03-10'), 'from');
  });

  it('a far-future day in a path or a query, without holding the server', async () => {
    const started = performance.now();
    expectBadInput(await staff.put('/api/roastery/rotation/9999-12-31').send({ lotCode: null }), 'date');
    expectBadInput(await staff.get('/api/orders?to=9999-12-31'), 'to');
    expectBadInput(await staff.get('/api/roastery/days/9999-12-31/roast-list'), 'date');
    expect(performance.now() - started).toBeLessThan(2_000);
    expect((await request(app).get('/api/health')).status).toBe(200);
  });
});

describe('a multipart body that cannot be read answers 400', () => {
  let code: string;
  beforeAll(async () => {
    code = (await createLotForSale(1_000)).code;
  });

  for (const [what, contentType, body] of [
    ['no boundary', 'multipart/form-data', '--x\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\n\r\nabc\r\n--x--\r\n'],
    ['the wrong boundary', 'multipart/form-data; boundary=y', '--x\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\n\r\nabc\r\n--x--\r\n'],
    ['a broken part header', 'multipart/form-data; boundary=x', '--x\r\nContent-Disposition form-data name file\r\n\r\nabc\r\n--x--\r\n'],
    ['a body cut short', 'multipart/form-data; boundary=x', '--x\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\n\r\nab'],
  ] as const) {
    it(`with ${what}`, async () => {
      const response = await staff.post(`/api/lots/${code}/photos`).set('Content-Type', contentType).send(body);
      expectBadInput(response, 'file');
    });
  }

  it('a file name with a NUL', async () => {
    const jpeg = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46]);
    expectBadInput(await staff.post(`/api/lots/${code}/photos`).attach('file', jpeg, 'photo\u0000.jpg'), 'file');
  });
});

describe('personal and staff answers are never kept by a cache', () => {
  it('sends Cache-Control: no-store on who-am-I, own orders, addresses and subscriptions, and staff reads', async () => {
    for (const path of ['/api/auth/me', '/api/orders', '/api/account/addresses', '/api/subscriptions']) {
      const response = await customer.get(path);
      expect(response.status, path).toBe(200);
      expect(response.headers['cache-control'], path).toBe('no-store');
    }
    for (const path of ['/api/roastery/subscribers', '/api/roastery/green-stock', '/api/roastery/outbox']) {
      const response = await staff.get(path);
      expect(response.status, path).toBe(200);
      expect(response.headers['cache-control'], path).toBe('no-store');
    }
    // The public lot list says itself that a cache may keep it briefly.
    expect((await request(app).get('/api/lots')).headers['cache-control']).toBe('public, max-age=10');
  });
});
