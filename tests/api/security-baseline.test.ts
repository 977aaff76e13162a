import { randomUUID } from 'node:crypto';
import { and, desc, eq, inArray } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { tokenFromFragment } from '@shared/schemas/auth';
import { apiErrorSchema } from '@shared/schemas/errors';
import { auditLog, emailOutbox, throttleCounters } from '../../server/db/schema/index';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { loadConfig } from '../../server/config';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { waitFor } from './outbox-support';
import { createTestUser, TEST_PASSWORD, testAddress } from '../factories/index';

const web = { 'X-Restday-Client': 'web' };
const app = createTestApp();

/** A documentation address (RFC 5737) per test, sent as X-Forwarded-For from the trusted loopback proxy. */
let lastOctet = 0;
const freshIp = () => `203.0.113.${++lastOctet}`;

describe('cross-site request forgery', () => {
  it('POST /api/auth/sign-in without X-Restday-Client, then 403 client_header_required and no session', async () => {
    const user = await createTestUser('customer');
    const response = await request(app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(response.status).toBe(403);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('client_header_required');
    expect(response.headers['set-cookie']).toBeUndefined();
  });

  it('a state-changing request whose Origin is another site, then 403 origin_mismatch even with the header', async () => {
    const user = await createTestUser('customer');
    const agent = await signedInAgent(app, user);
    const response = await agent.patch('/api/account/profile').set('Origin', 'https://elsewhere.example').send({ name: 'Hijacked' });
    expect(response.status).toBe(403);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('origin_mismatch');
    expect((await agent.get('/api/auth/me')).body.user.name).toBe(user.name);
  });

  it('an Origin equal to the host the request was addressed to, or to PUBLIC_URL, is accepted', async () => {
    const user = await createTestUser('customer');
    const sameHost = await request(app)
      .post('/api/auth/sign-in')
      .set(web)
      .set('Host', 'shop.internal:3000')
      .set('Origin', 'http://shop.internal:3000')
      .send({ email: user.email, password: user.password });
    expect(sameHost.status).toBe(200);
    const withPublicUrl = createTestApp({ env: { PUBLIC_URL: 'https://shop.example.test' } });
    const fromPublicUrl = await request(withPublicUrl)
      .post('/api/auth/sign-in')
      .set(web)
      .set('Origin', 'https://shop.example.test')
      .send({ email: user.email, password: user.password });
    expect(fromPublicUrl.status).toBe(200);
  });

  it('GET never signs anyone out: GET /api/auth/sign-out is not a route, and the session lives on', async () => {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    expect((await agent.get('/api/auth/sign-out')).status).toBe(404);
    expect((await agent.get('/api/auth/me')).body.user).not.toBeNull();
  });
});

describe('security headers', () => {
  const production = createTestApp({
    env: { NODE_ENV: 'production', PUBLIC_URL: 'https://shop.example.test', SESSION_SECRET: 'a-production-secret-for-tests-only-0123456789' },
  });

  function expectBaselineHeaders(headers: Record<string, string>) {
    const csp = headers['content-security-policy'] ?? '';
    for (const directive of ["object-src 'none'", "base-uri 'none'", "frame-ancestors 'none'", "default-src 'self'"]) expect(csp).toContain(directive);
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
    expect(headers['x-powered-by']).toBeUndefined();
  }

  it('an API response and a page response (the SPA shell, or its 404) both carry the CSP, nosniff and Referrer-Policy; HSTS only in production', async () => {
    for (const path of ['/api/health', '/', '/account/profile']) {
      const development = await request(app).get(path);
      expectBaselineHeaders(development.headers);
      expect(development.headers['strict-transport-security']).toBeUndefined();
      const live = await request(production).get(path);
      expectBaselineHeaders(live.headers);
      expect(live.headers['strict-transport-security']).toMatch(/max-age=\d{7,}/);
    }
  });

  it('an error response (401 from a guarded route) carries the same headers', async () => {
    const response = await request(production).get('/api/owner/team');
    expect(response.status).toBe(401);
    expectBaselineHeaders(response.headers);
    expect(response.headers['strict-transport-security']).toBeDefined();
  });
});

describe('throttling (limits at their defaults: 10 per account from one address, 30 per address, per 15 minutes)', () => {
  const clock = createAdjustableClock();
  // The default limits, unlike the other test files' app.
  const throttled = createTestApp({ clock, env: { AUTH_THROTTLE_PER_IP: '30' } });
  const signIn = (ip: string, email: string, password: string) =>
    request(throttled).post('/api/auth/sign-in').set(web).set('X-Forwarded-For', ip).send({ email, password });

  it('10 wrong passwords for one account from one address, then 429 with Retry-After — even for the right password', async () => {
    const user = await createTestUser('customer');
    const ip = freshIp();
    for (let attempt = 0; attempt < 10; attempt++) expect((await signIn(ip, user.email, `guess number ${attempt}`)).status).toBe(401);
    const blocked = await signIn(ip, user.email, user.password);
    expect(blocked.status).toBe(429);
    expect(apiErrorSchema.parse(blocked.body).error.code).toBe('too_many_attempts');
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(14 * 60);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
  });

  it('a guesser elsewhere cannot lock the customer out: from the customer’s own address the right password still signs in', async () => {
    const user = await createTestUser('customer');
    const attacker = freshIp();
    for (let attempt = 0; attempt < 12; attempt++) await signIn(attacker, user.email, `guess number ${attempt}`);
    expect((await signIn(attacker, user.email, user.password)).status).toBe(429);
    expect((await signIn(freshIp(), user.email, user.password)).status).toBe(200);
  });

  it('successful sign-ins do not count: 15 in a row from one address all succeed', async () => {
    const user = await createTestUser('customer');
    const ip = freshIp();
    for (let attempt = 0; attempt < 15; attempt++) expect((await signIn(ip, user.email, user.password)).status).toBe(200);
  });

  it('30 failed sign-ins across many accounts from one address, then that address gets 429 for any account', async () => {
    const ip = freshIp();
    for (let attempt = 0; attempt < 30; attempt++) expect((await signIn(ip, testAddress('spray'), 'spring2026spray')).status).toBe(401);
    const user = await createTestUser('customer');
    expect((await signIn(ip, user.email, user.password)).status).toBe(429);
  });

  it('once the window has passed, the address may try again', async () => {
    const user = await createTestUser('customer');
    const ip = freshIp();
    for (let attempt = 0; attempt < 11; attempt++) await signIn(ip, user.email, `guess number ${attempt}`);
    expect((await signIn(ip, user.email, user.password)).status).toBe(429);
    clock.set(new Date(clock.now().getTime() + 15 * 60_000 + 1000));
    expect((await signIn(ip, user.email, user.password)).status).toBe(200);
  });

  it('password reset: 10 requests for one address, then 429; sign-up: 30 from one address, then 429', async () => {
    const email = testAddress('resetflood');
    for (let attempt = 0; attempt < 10; attempt++) {
      expect((await request(throttled).post('/api/auth/password-reset').set(web).set('X-Forwarded-For', freshIp()).send({ email })).status).toBe(202);
    }
    expect((await request(throttled).post('/api/auth/password-reset').set(web).set('X-Forwarded-For', freshIp()).send({ email })).status).toBe(429);

    const ip = freshIp();
    const signUp = () =>
      request(throttled)
        .post('/api/auth/sign-up')
        .set(web)
        .set('X-Forwarded-For', ip)
        .send({ email: testAddress('bulk'), password: 'seven mossy stones', name: 'Bulk Invented' });
    for (let attempt = 0; attempt < 30; attempt++) expect((await signUp()).status).toBe(201);
    expect((await signUp()).status).toBe(429);
  });

  it('the counters store only hashes: no e-mail address or IP address is written to the throttle table', async () => {
    const user = await createTestUser('customer');
    const ip = freshIp();
    await signIn(ip, user.email, 'a wrong password');
    const keys = (await getTestDb().select({ key: throttleCounters.key }).from(throttleCounters)).map((row) => row.key);
    expect(keys.length).toBeGreaterThan(0);
    for (const key of keys) expect(key).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('audit trail', () => {
  it('every sign-in attempt is recorded with the account id and address, in UTC; passwords never', async () => {
    const user = await createTestUser('customer');
    const ip = freshIp();
    const at = (agentIp: string, password: string) =>
      request(app).post('/api/auth/sign-in').set(web).set('X-Forwarded-For', agentIp).send({ email: user.email, password });
    await at(ip, 'not my password');
    await at(ip, TEST_PASSWORD);
    const rows = await getTestDb().select().from(auditLog).where(eq(auditLog.actorId, user.id)).orderBy(auditLog.at);
    expect(rows.map((row) => [row.action, row.ip])).toEqual([
      ['sign_in.failed', ip],
      ['sign_in.succeeded', ip],
    ]);
    expect(rows[0]!.detail).toEqual({ reason: 'wrong_password' });
    expect(JSON.stringify(rows)).not.toContain(TEST_PASSWORD);
  });

  it('an authorization failure (staff on the owner’s Team page, a visitor on an account route) is recorded with who, where and what', async () => {
    const staff = await createTestUser('staff');
    const agent = await signedInAgent(app, staff);
    await agent.get('/api/owner/team').set('X-Forwarded-For', '198.51.100.7').expect(403);
    const [denied] = await getTestDb()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.actorId, staff.id), eq(auditLog.action, 'access.denied')));
    expect(denied).toMatchObject({ ip: '198.51.100.7', detail: { status: 403, code: 'forbidden', method: 'GET', path: '/api/owner/team', role: 'staff' } });

    const visitorIp = freshIp();
    await request(app).get('/api/account/addresses').set('X-Forwarded-For', visitorIp).expect(401);
    const [anonymous] = await getTestDb()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.ip, visitorIp), eq(auditLog.action, 'access.denied')))
      .orderBy(desc(auditLog.at));
    expect(anonymous).toMatchObject({ actorId: null, detail: { status: 401, code: 'sign_in_required', path: '/api/account/addresses' } });
  });
});

describe('log scan', () => {
  it('after sign-up, sign-in, a password reset, a password change, an invitation and sign-out, no log line holds a password, token, link or cookie value', async () => {
    const lines: string[] = [];
    const config = loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'trace' });
    const logged = createTestApp({ logger: createLogger(config, { write: (line: string) => lines.push(line) }) });
    const secrets: string[] = [];
    const email = testAddress('logscan');
    const firstPassword = 'lantern over the millpond';
    const secondPassword = 'copper kettle at dawn';
    const thirdPassword = 'nine quiet sparrows';
    secrets.push(firstPassword, secondPassword, thirdPassword);

    const agent = request.agent(logged).set(web);
    const signedUp = await agent.post('/api/auth/sign-up').send({ email, password: firstPassword, name: 'Log Scan' });
    expect(signedUp.status).toBe(201);
    const cookieValue = (c: string) => c.split(';')[0]!.split('=')[1]!;
    secrets.push(cookieValue(String(signedUp.headers['set-cookie'])));
    await agent.post('/api/auth/sign-in').send({ email, password: 'wrong horse battery' }).expect(401);
    await agent
      .post('/api/auth/sign-up')
      .send({ email: testAddress('weak'), password: 'password123', name: 'Weak' })
      .expect(400);
    const changed = await agent.put('/api/account/password').send({ currentPassword: firstPassword, newPassword: secondPassword });
    expect(changed.status).toBe(204);
    secrets.push(cookieValue(String(changed.headers['set-cookie'])));

    await agent.post('/api/auth/password-reset').send({ email }).expect(202);
    const [row] = await waitFor(
      () => getTestDb().select({ payload: emailOutbox.payload }).from(emailOutbox).where(eq(emailOutbox.toAddress, email)),
      (rows) => rows.length > 0,
      5000,
      'the reset e-mail',
    );
    const resetUrl = String(row!.payload.resetUrl);
    const resetToken = tokenFromFragment(new URL(resetUrl).hash)!;
    secrets.push(resetUrl, resetToken);
    await agent.post('/api/auth/password-reset/confirm').send({ token: resetToken, password: thirdPassword }).expect(204);
    await agent.post('/api/auth/sign-in').send({ email, password: thirdPassword }).expect(200);

    const owner = await createTestUser('owner');
    const ownerAgent = request.agent(logged).set(web);
    const ownerSignIn = await ownerAgent.post('/api/auth/sign-in').send({ email: owner.email, password: owner.password });
    secrets.push(cookieValue(String(ownerSignIn.headers['set-cookie'])));
    const invitee = testAddress('invitee');
    await ownerAgent.post('/api/owner/team').send({ email: invitee, role: 'staff' }).expect(201);
    const [invitation] = await getTestDb()
      .select({ payload: emailOutbox.payload })
      .from(emailOutbox)
      .where(and(eq(emailOutbox.toAddress, invitee), inArray(emailOutbox.template, ['staff-invitation'])));
    const acceptUrl = String(invitation!.payload.acceptUrl);
    const invitationToken = tokenFromFragment(new URL(acceptUrl).hash)!;
    secrets.push(acceptUrl, invitationToken);
    const joinerPassword = `fresh roast ${randomUUID().slice(0, 6)}`;
    secrets.push(joinerPassword);
    await request(logged).post('/api/auth/invitations/preview').set(web).send({ token: invitationToken }).expect(200);
    await request(logged)
      .post('/api/auth/invitations/accept')
      .set(web)
      .send({ token: invitationToken, name: 'New Roaster', password: joinerPassword })
      .expect(201);
    await agent.post('/api/auth/sign-out').expect(204);

    const log = lines.join('');
    expect(lines.length).toBeGreaterThan(20);
    expect(log).toContain('"audit":"sign_in.failed"');
    expect(log).toContain('"audit":"password_reset.completed"');
    for (const secret of secrets) expect(log.includes(secret), `a log line holds ${secret.slice(0, 12)}…`).toBe(false);
    // Times are ISO 8601 in UTC.
    expect(JSON.parse(lines[0]!).time).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
  });
});
