// Bad input never answers 5xx. Walks the router's own route list and, for every API route as a
// caller it allows, sends generated bad bodies, queries and path parameters (fast-check, fixed seed,
// so every run sends the same requests). Every answer must be below 500, every error must be in the
// one error shape, and a request answered 4xx must change no row of the shop's tables.
import { readdirSync, readFileSync } from 'node:fs';
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import type { Express } from 'express';
import request from 'supertest';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { createStripeClient } from '../../server/integrations/payments';
import { listRoutes } from '../setup/route-list';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { accessRules, type Access, type AccessRule } from '../api/access-rules';
import { createTestUser, type TestUser } from '../factories/index';

const seed = 20_261_202;
const bodiesPerRoute = 60;
const queriesPerRoute = 16;

// Throttling has its own tests; here it would only answer 429 to the auth routes after the first few.
const app = createTestApp({ env: { AUTH_THROTTLE_PER_ACCOUNT: '100000' } });
const apiRoutes = new Set(listRoutes(app).map((route) => `${route.method} ${route.path}`));

// Field names the API's own schemas use, so generated objects reach past "unknown field" into each field's checks.
const schemaDir = new URL('../../shared/schemas/', import.meta.url);
const fieldNames = [
  ...new Set(
    readdirSync(schemaDir)
      .filter((name) => name.endsWith('.ts') && !name.endsWith('.test.ts'))
      .flatMap((name) => [...readFileSync(new URL(name, schemaDir), 'utf8').matchAll(/^\s+'?([A-Za-z][\w-]*)'?:\s*z[.\s]/gm)].map((match) => match[1]!)),
  ),
].sort();

/** A well-formed id no row has; fixed, so every run sends the same requests. */
const unknownId = '5f0c6a7e-3b1d-4c2e-9a8f-1d2e3f4a5b6c';

const nested = (depth: number): unknown => (depth === 0 ? 'bottom' : { items: [nested(depth - 1)] });
const nestedArrays = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;

/** Values that are wrong almost everywhere, and a few that are nearly right, so checks past the first get reached. */
const nastyValues: unknown[] = [
  null,
  [],
  {},
  '',
  ' ',
  'x'.repeat(5_000),
  '\u0000',
  'a\u0000b',
  '\ud800',
  'a\udfffb',
  '\ufeff',
  '<b>',
  "'; drop table lots; --",
  -1,
  0,
  0.5,
  -0.0001,
  1e308,
  -1e308,
  2 ** 31,
  2 ** 53 + 1,
  1e21,
  Number.MAX_SAFE_INTEGER,
  true,
  false,
  [null],
  [[]],
  [{}],
  { a: null },
  ['1lb'],
  { '': 1 },
  { constructor: { prototype: {} } },
  '2026-02-30',
  '2026-12-08',
  '0000-01-01',
  '9999-12-31',
  '2026-13-01',
  '2026-12-08T25:00',
  '1lb',
  '12oz',
  '8oz',
  '5lb',
  'medium',
  'light',
  'arrival',
  'loss',
  'count',
  'washed',
  'green',
  'paid',
  '00000000-0000-0000-0000-000000000000',
  unknownId,
  'not-a-uuid',
  'someone@example.test',
  'RD-001',
  '1e999',
  'NaN',
  '-1',
  '٣',
  nested(10),
  nested(600),
];

const nasty = fc.constantFrom(...nastyValues);
const value: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 5, arbitrary: nasty },
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.integer(),
  fc.double({ noNaN: true }),
  fc.array(nasty, { maxLength: 4 }),
  fc.dictionary(fc.constantFrom(...fieldNames), nasty, { maxKeys: 4 }),
);

function bodyArbitrary(example: Record<string, unknown> | undefined): fc.Arbitrary<unknown> {
  const object = fc.dictionary(fc.constantFrom(...fieldNames), value, { maxKeys: 8 });
  const arbitraries: fc.Arbitrary<unknown>[] = [nasty, object];
  if (example) {
    const keys = Object.keys(example);
    // The route's own valid example with one field broken or missing.
    arbitraries.push(
      fc.tuple(fc.constantFrom(...keys), value, fc.boolean()).map(([key, broken, drop]) => {
        const copy: Record<string, unknown> = { ...example };
        if (drop) delete copy[key];
        else copy[key] = broken;
        return copy;
      }),
    );
  }
  return fc.oneof(...arbitraries);
}

/** Raw bodies JSON cannot build: truncated, deeply nested, a bare NUL escape. */
const rawBodies = [
  '{',
  '[]',
  'null',
  '"\\u0000"',
  nestedArrays(5_000),
  `{"a":${'['.repeat(2_000)}${']'.repeat(2_000)}}`,
  '{"items":"\\ud800"}',
  '{"__proto__":{"role":"owner"}}',
];

const queryNames = [
  'page',
  'pageSize',
  'status',
  'kind',
  'from',
  'to',
  'sort',
  'dir',
  'order',
  'q',
  'count',
  'level',
  'lot',
  'date',
  'reason',
  'limit',
  'cursor',
  'roastDate',
  'tab',
];
const queryValues = [
  '-1',
  '0',
  '1e309',
  '99999999999999999999',
  '1.5',
  '',
  ' ',
  'null',
  '[]',
  '2026-02-30',
  '9999-12-31',
  'x'.repeat(3_000),
  'a\u0000b',
  'zzz',
];
const query = fc
  .array(fc.tuple(fc.constantFrom(...queryNames), fc.oneof(fc.constantFrom(...queryValues), fc.string({ unit: 'grapheme', maxLength: 12 }))), {
    minLength: 1,
    maxLength: 5,
  })
  .map((pairs) => pairs.map(([name, text]) => `${name}=${encodeURIComponent(text)}`).join('&'));
/** Percent-escapes no UTF-8 decoder accepts, and repeated keys (an array where a string is expected). */
const rawQueries = ['q=%ED%A0%80', 'q=%00', 'page=%FF', 'q=%', 'q=%zz', 'page=1&page=2', 'status=paid&status=bogus', 'from[x]=1', '%ED%A0%80=1'];

/** Already percent-encoded path parameters: wrong shapes, bad escapes, NUL, a lone surrogate, huge. */
const badParams = [
  '-1',
  '0',
  'null',
  '%00',
  'a%00b',
  '%ED%A0%80',
  '%FF',
  '%',
  '%zz',
  '%2e%2e',
  'x'.repeat(2_000),
  '2026-02-30',
  '99999-12-31',
  '1e309',
  'not-a-uuid',
  '00000000-0000-0000-0000-000000000000',
  '%20',
  encodeURIComponent("'; drop table lots; --"),
];

type Caller = 'visitor' | 'customer' | 'staff' | 'owner';
const callerFor = (access: Access): Caller =>
  access === 'public' || access === 'signed-request'
    ? 'visitor'
    : access === 'staff' || access === 'packing'
      ? 'staff'
      : access === 'owner'
        ? 'owner'
        : 'customer';

const people = {} as Record<Exclude<Caller, 'visitor'>, TestUser>;
const agents = new Map<Caller, ReturnType<typeof request.agent>>();

async function agentFor(target: Express, caller: Caller, fresh = false) {
  if (caller === 'visitor') return request.agent(target).set('X-Restday-Client', 'web');
  if (!fresh && agents.has(caller)) return agents.get(caller)!;
  const agent = await signedInAgent(target, people[caller]);
  agents.set(caller, agent);
  return agent;
}

let checksumSql: ReturnType<typeof sql.raw>;

/** One digest per table of the shop's data (order-independent); sessions and throttle counters move on every request by design. */
async function shopChecksum(): Promise<Record<string, string>> {
  const rows = await getTestDb().execute(checksumSql);
  return (rows as unknown as { rows: Record<string, string>[] }).rows[0]!;
}

interface Sent {
  route: string;
  what: string;
  status: number;
  body: unknown;
}

const fiveHundreds: Sent[] = [];
const badShapes: Sent[] = [];
const changedBy4xx: { sent: Sent; tables: string[] }[] = [];
let sentCount = 0;

type Verb = 'get' | 'post' | 'put' | 'patch' | 'delete';

async function send(rule: AccessRule, path: string, what: string, attach: (call: request.Test) => request.Test) {
  const caller = callerFor(rule.access);
  let agent = await agentFor(app, caller);
  const before = rule.method === 'GET' ? undefined : await shopChecksum();
  let response = await attach(agent[rule.method.toLowerCase() as Verb](path));
  if (response.status === 401 && caller !== 'visitor') {
    // An earlier request ended the session (a password change, a sign-out): sign in again and resend.
    agent = await agentFor(app, caller, true);
    response = await attach(agent[rule.method.toLowerCase() as Verb](path));
  }
  sentCount++;
  const sent: Sent = { route: `${rule.method} ${rule.path}`, what, status: response.status, body: response.body as unknown };
  if (response.status >= 500) fiveHundreds.push(sent);
  if (response.status >= 400 && !apiErrorSchema.safeParse(response.body).success) badShapes.push(sent);
  if (before && response.status >= 400 && response.status < 500) {
    const after = await shopChecksum();
    const tables = Object.keys(before).filter((table) => before[table] !== after[table]);
    if (tables.length > 0) changedBy4xx.push({ sent, tables });
  }
}

const describeValue = (body: unknown) => {
  const text = typeof body === 'string' ? body : (JSON.stringify(body) ?? String(body));
  return text.length > 120 ? `${text.slice(0, 120)}… (${text.length} chars)` : text;
};

beforeAll(async () => {
  people.customer = await createTestUser('customer');
  people.staff = await createTestUser('staff');
  people.owner = await createTestUser('owner');
  const tables = await getTestDb().execute(
    sql`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not in ('sessions', 'throttle_counters') order by table_name`,
  );
  const names = (tables as unknown as { rows: { table_name: string }[] }).rows.map((row) => row.table_name);
  checksumSql = sql.raw(
    `select ${names.map((name) => `(select md5(coalesce(string_agg(md5(t::text), '' order by md5(t::text)), '')) from "${name}" t) as "${name}"`).join(', ')}`,
  );
});

describe('bad input on every API route', () => {
  it('never answers 5xx, always answers errors in the error shape, and a 4xx changes nothing', { timeout: 240_000 }, async () => {
    const rules = accessRules.filter((rule) => apiRoutes.has(`${rule.method} ${rule.path}`));
    expect(rules.length).toBeGreaterThan(60);
    for (const [index, rule] of rules.entries()) {
      const params = { ...rule.params, ...(rule.record ? await rule.record(people.customer) : {}) };
      const goodPath = rule.path.replace(/:(\w+)/g, (_match, name: string) => encodeURIComponent(params[name] ?? unknownId));

      if (rule.method !== 'GET') {
        for (const body of fc.sample(bodyArbitrary(rule.body), { seed: seed + index, numRuns: bodiesPerRoute })) {
          await send(rule, goodPath, `body ${describeValue(body)}`, (call) =>
            call.set('Content-Type', 'application/json').send(JSON.stringify(body) ?? 'null'),
          );
        }
        for (const raw of rawBodies) {
          await send(rule, goodPath, `raw body ${describeValue(raw)}`, (call) => call.set('Content-Type', 'application/json').send(raw));
        }
      }
      for (const text of [...fc.sample(query, { seed: seed + 1_000 + index, numRuns: queriesPerRoute }), ...rawQueries]) {
        await send(rule, `${goodPath}?${text}`, `query ${describeValue(text)}`, (call) => (rule.body ? call.send(rule.body) : call));
      }
      for (const name of [...rule.path.matchAll(/:(\w+)/g)].map((match) => match[1]!)) {
        for (const bad of badParams) {
          const path = rule.path.replace(/:(\w+)/g, (_match, each: string) => (each === name ? bad : encodeURIComponent(params[each] ?? unknownId)));
          await send(rule, path, `:${name} = ${describeValue(bad)}`, (call) => (rule.body ? call.send(rule.body) : call));
        }
      }
    }

    const report = (list: Sent[]) => list.map((sent) => `${sent.route} ${sent.what} → ${sent.status} ${describeValue(sent.body)}`);
    expect(report(fiveHundreds)).toEqual([]);
    expect(report(badShapes)).toEqual([]);
    expect(changedBy4xx.map(({ sent, tables }) => `${sent.route} ${sent.what} → ${sent.status} changed ${tables.join(', ')}`)).toEqual([]);
    expect(sentCount).toBeGreaterThan(2_000);
  });

  it('a correctly signed webhook with a broken body answers 400, never 500', async () => {
    const stripe = createStripeClient({ STRIPE_SECRET_KEY: 'sk_test_restday_local' });
    const broken = [
      '[]',
      'null',
      '{}',
      '"event"',
      '{"id":"evt_fuzz_1","type":"checkout.session.completed"}',
      '{"id":"evt_fuzz_2","type":"checkout.session.completed","data":null}',
      '{"id":"evt_fuzz_3","type":"checkout.session.completed","data":{}}',
      '{"id":"evt_fuzz_4","type":"checkout.session.completed","data":{"object":null}}',
      '{"id":"evt_fuzz_5","type":"charge.refunded","data":{"object":[]}}',
      '{"id":"evt_fuzz_6","type":"invoice.paid","data":{"object":{"id":42}}}',
      '{"id":42,"type":"checkout.session.expired","data":{"object":{"id":"cs_test_x"}}}',
      '{"id":"evt_fuzz_7","type":null,"data":{"object":{"id":"cs_test_x"}}}',
      `{"id":"evt_fuzz_8","type":"checkout.session.completed","data":{"object":{"id":"cs_${'\\u0000'}"}}}`,
    ];
    for (const payload of broken) {
      const header = stripe.webhooks.generateTestHeaderString({ payload, secret: inject('stripeWebhookSecret') });
      const response = await request(app).post('/api/payments/webhook').set('Content-Type', 'application/json').set('Stripe-Signature', header).send(payload);
      expect(response.status, `${payload} → ${response.status} ${JSON.stringify(response.body)}`).toBe(400);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('invalid_webhook');
    }
  });
});
