import { readFile } from 'node:fs/promises';
import { randomUUID } from 'node:crypto';
import { parseOptions } from '@node-rs/argon2';
import { eq } from 'drizzle-orm';
import { SignJWT } from 'jose';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { PASSWORD_MAX_LENGTH, userResponseSchema } from '@shared/schemas/auth';
import { apiErrorSchema } from '@shared/schemas/errors';
import type { Role } from '@shared/domain/vocabulary';
import { sessions, users } from '../../server/db/schema/index';
import { demoSignIns, seedDemo } from '../../server/db/seed/index';
import { verifyPassword } from '../../server/lib/password-hashing';
import { commonPasswordCount } from '../../server/modules/auth/password-policy';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { authTestApp, DAY, HOUR, MINUTE, sessionCookie, web } from './auth-support';
import { createTestUser, testAddress } from '../factories/index';

const { app, client, advance, me, signUp, signIn } = authTestApp();

describe('sign-up, sign-in, sign-out and me', () => {
  it('POST /api/auth/sign-up — with a sound password, then 201 {user} as a customer, signed in at once', async () => {
    const email = testAddress('newcomer');
    const response = await signUp({ email: `  ${email.toUpperCase()} ` });
    expect(response.status).toBe(201);
    const { user } = userResponseSchema.parse(response.body);
    expect(user).toMatchObject({ email, name: 'Sam Invented', role: 'customer' });
    const current = await me(sessionCookie(response));
    expect(current.status).toBe(200);
    expect(current.body).toEqual({ user });
  });

  it('POST /api/auth/sign-up — then the stored hash is argon2id at m=19456 KiB, t=2, p=1 and never the password', async () => {
    const email = testAddress('hash');
    await signUp({ email, password: 'amber lantern orchard' }).expect(201);
    const [row] = await getTestDb().select({ passwordHash: users.passwordHash }).from(users).where(eq(users.email, email));
    expect(row!.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(parseOptions(row!.passwordHash)).toMatchObject({ algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1, saltLen: 16 });
    expect(row!.passwordHash).not.toContain('amber');
  });

  it('POST /api/auth/sign-up — with an address that already has an account (in any case), then 409 and no second account', async () => {
    const email = testAddress('taken');
    await signUp({ email }).expect(201);
    const again = await signUp({ email: email.toUpperCase() });
    expect(again.status).toBe(409);
    expect(apiErrorSchema.parse(again.body).error.code).toBe('email_taken');
    expect(await getTestDb().select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it('POST /api/auth/sign-in — with the right password, then 200 {user} and a session; the wrong one and an unknown address get the same 401', async () => {
    const user = await createTestUser('customer');
    const ok = await signIn(user.email, user.password);
    expect(ok.status).toBe(200);
    expect(userResponseSchema.parse(ok.body).user).toEqual({ id: user.id, email: user.email, name: user.name, role: 'customer' });

    const wrongPassword = await signIn(user.email, 'not the password at all');
    const unknownEmail = await signIn(testAddress('nobody'), 'not the password at all');
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(unknownEmail.body).toEqual(wrongPassword.body);
    expect(wrongPassword.headers['set-cookie']).toBeUndefined();
  });

  it('POST /api/auth/sign-in — an unknown address takes about as long as a wrong password (both verify an argon2id hash)', async () => {
    const user = await createTestUser('customer');
    const ghost = testAddress('ghost');
    const timings = { known: [] as number[], unknown: [] as number[] };
    // Interleaved, after one warm-up each, so neither side pays for a cold start.
    for (let attempt = -1; attempt < 9; attempt++) {
      for (const [side, email] of [
        ['known', user.email],
        ['unknown', ghost],
      ] as const) {
        const started = performance.now();
        await signIn(email, `wrong password ${attempt}`).expect(401);
        if (attempt >= 0) timings[side].push(performance.now() - started);
      }
    }
    const median = (times: number[]) => times.sort((a, b) => a - b)[Math.floor(times.length / 2)]!;
    const known = median(timings.known);
    const unknown = median(timings.unknown);
    console.info(`sign-in timing, median of 9: wrong password ${known.toFixed(1)} ms, unknown address ${unknown.toFixed(1)} ms`);
    // Without the decoy hash an unknown address answers in ~2 ms against ~15 ms for a known one.
    expect(unknown / known).toBeGreaterThan(0.6);
    expect(unknown / known).toBeLessThan(1.6);
  });

  it('GET /api/auth/me — without a session, then 200 with no user (a visitor asking is not an error)', async () => {
    const response = await client().get('/api/auth/me');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ user: null });
  });

  it('POST /api/auth/sign-out — then 204, the cookie is cleared, and replaying the old cookie is refused (the session row is revoked)', async () => {
    const user = await createTestUser('customer');
    const cookie = sessionCookie(await signIn(user.email, user.password));
    expect((await me(cookie)).body.user).not.toBeNull();
    const out = await client().post('/api/auth/sign-out').set(web).set('Cookie', cookie);
    expect(out.status).toBe(204);
    expect(String(out.headers['set-cookie'])).toMatch(/restday_session=;.*Expires=Thu, 01 Jan 1970/);
    expect((await me(cookie)).body.user).toBeNull();
    const rows = await getTestDb().select({ revokedAt: sessions.revokedAt }).from(sessions).where(eq(sessions.userId, user.id));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.revokedAt).not.toBeNull();
  });

  it('the session cookie — HttpOnly, SameSite=Lax, Path=/, carries no Secure flag outside production', async () => {
    const user = await createTestUser('customer');
    const header = String((await signIn(user.email, user.password)).headers['set-cookie']);
    expect(header).toMatch(/^restday_session=[\w-]+\.[\w-]+\.[\w-]+;/);
    expect(header).toContain('HttpOnly');
    expect(header).toContain('SameSite=Lax');
    expect(header).toContain('Path=/');
    expect(header).not.toContain('Secure');
    expect(header).not.toContain('Domain=');
  });

  it('the session cookie — in production, then named __Host-…, Secure, HttpOnly, SameSite=Lax, Path=/ and without a Domain', async () => {
    const production = createTestApp({
      env: { NODE_ENV: 'production', PUBLIC_URL: 'https://shop.example.test', SESSION_SECRET: 'a-production-secret-for-tests-only-0123456789' },
    });
    const user = await createTestUser('customer');
    const response = await request(production).post('/api/auth/sign-in').set(web).send({ email: user.email, password: user.password });
    expect(response.status).toBe(200);
    const header = String(response.headers['set-cookie']);
    expect(header).toMatch(/^__Host-restday_session=[\w-]+\.[\w-]+\.[\w-]+;/);
    for (const flag of ['Secure', 'HttpOnly', 'SameSite=Lax', 'Path=/']) expect(header).toContain(flag);
    expect(header).not.toContain('Domain=');
  });
});

describe('session tokens', () => {
  async function liveToken() {
    const user = await createTestUser('customer');
    const cookie = sessionCookie(await signIn(user.email, user.password));
    return { user, token: cookie.slice('restday_session='.length) };
  }

  it('a token with a changed payload, one signed with another key, or one with alg "none", then no one is signed in', async () => {
    const { user, token } = await liveToken();
    const [header, payload, signature] = token.split('.');
    const claims = JSON.parse(Buffer.from(payload!, 'base64url').toString()) as Record<string, unknown>;
    const tampered = `${header}.${Buffer.from(JSON.stringify({ ...claims, sub: randomUUID() })).toString('base64url')}.${signature}`;
    const otherKey = await new SignJWT(claims).setProtectedHeader({ alg: 'HS256' }).sign(new TextEncoder().encode('someone-else-s-secret-someone-else-s'));
    const unsigned = `${Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url')}.${payload}.`;
    for (const forged of [tampered, otherKey, unsigned]) {
      expect((await me(`restday_session=${forged}`)).body.user, forged.slice(0, 30)).toBeNull();
    }
    expect((await me(`restday_session=${token}`)).body.user.id).toBe(user.id);
  });

  it('a genuine token whose session row was revoked in the database, then signed out on the next request', async () => {
    const { user, token } = await liveToken();
    await getTestDb().update(sessions).set({ revokedAt: new Date() }).where(eq(sessions.userId, user.id));
    expect((await me(`restday_session=${token}`)).body.user).toBeNull();
  });

  it('the session id (jti) is 256 random bits and only its SHA-256 is stored', async () => {
    const { user, token } = await liveToken();
    const claims = JSON.parse(Buffer.from(token.split('.')[1]!, 'base64url').toString()) as { jti: string; aud: string; iss: string; exp: number };
    expect(Buffer.from(claims.jti, 'base64url')).toHaveLength(32);
    expect(claims).toMatchObject({ aud: 'restday-web', iss: 'restday' });
    const [row] = await getTestDb().select({ id: sessions.id }).from(sessions).where(eq(sessions.userId, user.id));
    expect(row!.id).toMatch(/^[0-9a-f]{64}$/);
    expect(row!.id).not.toContain(claims.jti);
  });
});

describe('session timeouts (the app clock moves; DEVELOPERS.md gives the reasons)', () => {
  async function signedInCookie(role: Role) {
    const user = await createTestUser(role);
    return { user, cookie: sessionCookie(await signIn(user.email, user.password)) };
  }

  it('a customer idle for 6 days is still signed in; idle for 7 days, then signed out', async () => {
    const { cookie } = await signedInCookie('customer');
    advance(6 * DAY);
    expect((await me(cookie)).body.user).not.toBeNull();
    advance(7 * DAY + MINUTE);
    expect((await me(cookie)).body.user).toBeNull();
  });

  it('a customer active every few days is signed out 30 days after signing in', async () => {
    const { cookie } = await signedInCookie('customer');
    for (let day = 5; day < 30; day += 5) {
      advance(5 * DAY);
      expect((await me(cookie)).body.user).not.toBeNull();
    }
    advance(5 * DAY);
    expect((await me(cookie)).body.user).toBeNull();
  });

  it('staff idle for 30 minutes, then signed out', async () => {
    const { cookie } = await signedInCookie('staff');
    advance(29 * MINUTE);
    expect((await me(cookie)).body.user).not.toBeNull();
    advance(30 * MINUTE);
    expect((await me(cookie)).body.user).toBeNull();
  });

  it('an owner active all day is signed out 12 hours after signing in', async () => {
    const { cookie } = await signedInCookie('owner');
    // Every 20 minutes for 11 hours 40 minutes: never idle for long, still signed in.
    for (let step = 0; step < 35; step++) {
      advance(20 * MINUTE);
      expect((await me(cookie)).body.user).not.toBeNull();
    }
    advance(21 * MINUTE);
    expect((await me(cookie)).body.user).toBeNull();
  });

  it('a customer promoted to staff mid-session, then the staff limits apply to that session at once', async () => {
    const { user, cookie } = await signedInCookie('customer');
    advance(2 * HOUR);
    expect((await me(cookie)).body.user).not.toBeNull();
    await getTestDb().update(users).set({ role: 'staff' }).where(eq(users.id, user.id));
    advance(31 * MINUTE);
    expect((await me(cookie)).body.user).toBeNull();
  });
});

describe('password rules (OWASP ASVS 5.0 V6)', () => {
  it(`the common-password list holds at least 3,000 entries (${commonPasswordCount})`, () => {
    expect(commonPasswordCount).toBeGreaterThanOrEqual(3000);
  });

  it('a common password is refused with 400 weak_password naming the field, whatever its case', async () => {
    for (const password of ['password1', 'Baseball1', 'iloveyou']) {
      const response = await signUp({ password });
      expect(response.status, password).toBe(400);
      const { error } = apiErrorSchema.parse(response.body);
      expect(error.code).toBe('weak_password');
      expect(Object.keys(error.fields ?? {})).toEqual(['password']);
    }
  });

  it('a password made of the shop’s name or the person’s own name or e-mail is refused', async () => {
    const email = testAddress('wrenna');
    for (const password of ['Restday2026!', 'Sam.Invented1', email]) {
      expect((await signUp({ email, password, name: 'Sam Invented' })).status, password).toBe(400);
    }
  });

  it('7 characters are refused; 8 are accepted; no letters, digits or symbols are required', async () => {
    const short = await signUp({ password: 'tvx#q7w' });
    expect(short.status).toBe(400);
    expect(apiErrorSchema.parse(short.body).error.fields?.password).toMatch(/at least 8/);
    expect((await signUp({ password: 'zqxvbnmt' })).status).toBe(201);
  });

  it('length counts characters, not bytes: 8 emoji are accepted, 7 are refused', async () => {
    expect((await signUp({ password: '☕🫘🔥☕🫘🔥☕' })).status).toBe(400);
    expect((await signUp({ password: '☕🫘🔥☕🫘🔥☕🫘' })).status).toBe(201);
  });

  it(`64 and ${PASSWORD_MAX_LENGTH} characters are accepted and never truncated: every character counts at sign-in`, async () => {
    for (const length of [64, 100, PASSWORD_MAX_LENGTH]) {
      const password = 'roast-curve '.repeat(30).slice(0, length - 1) + 'Z';
      const email = testAddress(`long${length}`);
      expect((await signUp({ email, password })).status, `length ${length}`).toBe(201);
      expect((await signIn(email, password)).status).toBe(200);
      expect((await signIn(email, password.slice(0, -1))).status).toBe(401);
      expect((await signIn(email, `${password.slice(0, -1)}Y`)).status).toBe(401);
    }
    expect((await signUp({ password: 'x'.repeat(PASSWORD_MAX_LENGTH + 1) })).status).toBe(400);
  });

  it('spaces are kept as typed: a password with leading and trailing spaces does not match without them', async () => {
    const email = testAddress('spaces');
    await signUp({ email, password: '  two spaces each side  ' }).expect(201);
    expect((await signIn(email, '  two spaces each side  ')).status).toBe(200);
    expect((await signIn(email, 'two spaces each side')).status).toBe(401);
  });
});

describe('disabled accounts', () => {
  it('a disabled account cannot sign in (403 account_disabled, only with the right password) and its open session ends on the next request', async () => {
    const user = await createTestUser('staff');
    const cookie = sessionCookie(await signIn(user.email, user.password));
    await getTestDb().update(users).set({ disabledAt: new Date() }).where(eq(users.id, user.id));
    expect((await me(cookie)).body.user).toBeNull();
    const refused = await signIn(user.email, user.password);
    expect(refused.status).toBe(403);
    expect(apiErrorSchema.parse(refused.body).error.code).toBe('account_disabled');
    expect((await signIn(user.email, 'a wrong password here')).status).toBe(401);
  });
});

describe('demo accounts', () => {
  it('the seed creates every README demo sign-in with its role and the password restday-demo (argon2id)', async () => {
    const db = getTestDb();
    // Seeded inside a transaction that is rolled back, so other test files never see the demo shop.
    const rollback = new Error('rollback');
    await db
      .transaction(async (tx) => {
        await tx.execute('delete from shop_settings');
        await seedDemo(tx, { now: new Date('2026-12-01T15:00:00Z') });
        for (const demo of demoSignIns) {
          const [row] = await tx.select().from(users).where(eq(users.email, demo.email));
          expect(row, demo.email).toBeDefined();
          expect(row!.role).toBe(demo.role);
          expect(row!.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
          expect(await verifyPassword(row!.passwordHash, 'restday-demo')).toBe(true);
        }
        expect(new Set(demoSignIns.map((demo) => demo.role))).toEqual(new Set(['customer', 'packer', 'staff', 'owner']));
        const readme = await readFile(new URL('../../README.md', import.meta.url), 'utf8');
        for (const demo of demoSignIns) expect(readme, demo.email).toContain(`| ${demo.email}`);
        throw rollback;
      })
      .catch((error: unknown) => {
        if (error !== rollback) throw error;
      });
  });
});

describe('signedInAgent (the helper other API tests use)', () => {
  it('keeps the session cookie and the client header across requests', async () => {
    const user = await createTestUser('owner');
    const agent = await signedInAgent(app, user);
    expect((await agent.get('/api/auth/me')).body.user.role).toBe('owner');
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).body.user).toBeNull();
  });
});
