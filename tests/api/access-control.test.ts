import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../setup/route-list';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { accessRules, type Access, type AccessRule } from './access-rules';
import { createTestUser, type TestUser } from '../factories/index';

const app = createTestApp();
const apiRoutes = listRoutes(app).filter((route) => route.path.startsWith('/api/'));
const ruleKey = (route: { method: string; path: string }) => `${route.method} ${route.path}`;

const callers = ['visitor', 'customer A', 'customer B', 'packer', 'staff', 'owner'] as const;
type Caller = (typeof callers)[number];

type Expectation = 'allowed' | 'not signed in' | 'wrong role' | 'someone else’s record' | 'refused without its proof';

function expectationFor(access: Access, caller: Caller): Expectation {
  if (access === 'public') return 'allowed';
  if (access === 'signed-request') return 'refused without its proof';
  if (caller === 'visitor') return 'not signed in';
  switch (access) {
    case 'signed-in':
      return 'allowed';
    case 'own-record':
      return caller === 'customer A' ? 'allowed' : 'someone else’s record';
    case 'own-or-staff':
      return caller === 'customer A' || caller === 'staff' || caller === 'owner' ? 'allowed' : 'someone else’s record';
    case 'own-or-team':
      return caller === 'customer B' ? 'someone else’s record' : 'allowed';
    case 'packing':
      return caller === 'packer' || caller === 'staff' || caller === 'owner' ? 'allowed' : 'wrong role';
    case 'staff':
      return caller === 'staff' || caller === 'owner' ? 'allowed' : 'wrong role';
    case 'owner':
      return caller === 'owner' ? 'allowed' : 'wrong role';
  }
}

const people = {} as Record<Exclude<Caller, 'visitor'>, TestUser>;
const agents = new Map<Caller, ReturnType<typeof request.agent>>();

/** The caller's agent, signed in again when the last request ended its session (sign-out, password change). */
async function agentFor(app: Express, caller: Caller) {
  if (caller === 'visitor') return request.agent(app).set('X-Restday-Client', 'web');
  const current = agents.get(caller);
  if (current && (await current.get('/api/auth/me')).body.user) return current;
  const fresh = await signedInAgent(app, people[caller]);
  agents.set(caller, fresh);
  return fresh;
}

async function pathFor(rule: AccessRule): Promise<string> {
  const params = { ...rule.params, ...(rule.record ? await rule.record(people['customer A']) : {}) };
  return rule.path.replace(/:(\w+)/g, (_match, name: string) => encodeURIComponent(params[name] ?? randomUUID()));
}

beforeAll(async () => {
  people['customer A'] = await createTestUser('customer');
  people['customer B'] = await createTestUser('customer');
  people.packer = await createTestUser('packer');
  people.staff = await createTestUser('staff');
  people.owner = await createTestUser('owner');
});

describe('the access-control rules cover the router exactly', () => {
  it('every API route the app answers has one rule in tests/api/access-rules.ts', () => {
    const ruled = new Set(accessRules.map(ruleKey));
    expect(apiRoutes.map(ruleKey).filter((key) => !ruled.has(key))).toEqual([]);
    expect(accessRules.length).toBe(ruled.size);
  });

  it('every rule names a route the app answers', () => {
    const answered = new Set(apiRoutes.map(ruleKey));
    expect(accessRules.map(ruleKey).filter((key) => !answered.has(key))).toEqual([]);
  });

  it('own-record, own-or-staff and own-or-team rules make a record to ask for', () => {
    const ownRecordRules = new Set<Access>(['own-record', 'own-or-staff', 'own-or-team']);
    expect(accessRules.filter((rule) => ownRecordRules.has(rule.access) && !rule.record).map(ruleKey)).toEqual([]);
  });
});

describe('access-control matrix: every API route × visitor, customer A, customer B, packer, staff, owner', () => {
  for (const rule of accessRules) {
    for (const caller of callers) {
      const expected = expectationFor(rule.access, caller);
      it(`${rule.method} ${rule.path} as ${caller} → ${expected}`, async () => {
        const agent = await agentFor(app, caller);
        const path = await pathFor(rule);
        const call = agent[rule.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](path);
        const response = await (rule.body ? call.send(rule.body) : call);
        const { status } = response;
        const seen = `${status} ${JSON.stringify(response.body).slice(0, 200)}`;
        expect(status, seen).toBeLessThan(500);
        switch (expected) {
          case 'allowed':
            expect([401, 403], seen).not.toContain(status);
            if (rule.record) expect(status, seen).not.toBe(404);
            break;
          case 'not signed in':
            expect(status, seen).toBe(401);
            break;
          case 'wrong role':
            expect(status, seen).toBe(403);
            break;
          case 'someone else’s record':
            expect([403, 404], seen).toContain(status);
            break;
          case 'refused without its proof':
            expect(status, seen).toBeGreaterThanOrEqual(400);
            break;
        }
      });
    }
  }
});
