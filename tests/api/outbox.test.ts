import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it, onTestFinished } from 'vitest';
import { ZodError } from 'zod';
import { devClockResponseSchema } from '@shared/schemas/dev-clock';
import { apiErrorSchema } from '@shared/schemas/errors';
import { outboxListResponseSchema } from '@shared/schemas/outbox';
import { demoEmailPayloads } from '../../emails/demo';
import { createApp } from '../../server/app';
import { emailOutbox } from '../../server/db/schema/index';
import { startQueue } from '../../server/jobs/queue';
import { startWorkers } from '../../server/jobs/workers';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { queueEmail } from '../../server/modules/outbox/outbox.repo';
import { createTestApp } from '../setup/test-app';
import { getTestDatabase, getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { inboxOf, outboxRow, outboxRows, restDayPayload, testConfig, testRelay, waitFor } from './outbox-support';
import { createTestUser, testAddress, type TestUser } from '../factories/index';

const smtpUrl = inject('smtpUrl');
const mailCatcherUrl = inject('mailCatcherUrl');
const DAY_MS = 24 * 60 * 60 * 1000;

const cleanups: (() => Promise<void> | void)[] = [];
afterAll(async () => {
  for (const cleanup of cleanups.reverse()) await cleanup();
});

function relayForTest(options: Parameters<typeof testRelay>[0] = { smtpUrl }) {
  const made = testRelay(options);
  cleanups.push(() => made.mailer.close());
  return made;
}

describe('queueEmail', () => {
  it('writes nothing and sends nothing when the transaction rolls back', async () => {
    const to = testAddress('rollback');
    const key = `rest-day:${randomUUID()}`;
    await expect(
      getTestDb().transaction(async (tx) => {
        await queueEmail(tx, { template: 'rest-day', to, payload: restDayPayload(randomUUID()), dedupeKey: key });
        throw new Error('the order change failed');
      }),
    ).rejects.toThrow('the order change failed');

    expect(await outboxRow(key)).toBeUndefined();
    await relayForTest().relay.relayOnce();
    expect(await inboxOf(mailCatcherUrl, to)).toEqual([]);
  });

  it('queues the same dedupeKey once, however often it is asked', async () => {
    const to = testAddress('dedupe');
    const key = `order-confirmed:${randomUUID()}`;
    const payload = { ...demoEmailPayloads['order-confirmed'], orderId: randomUUID() };
    await queueEmail(getTestDb(), { template: 'order-confirmed', to, payload, dedupeKey: key });
    await getTestDb().transaction((tx) => queueEmail(tx, { template: 'order-confirmed', to, payload, dedupeKey: key }));
    await queueEmail(getTestDb(), { template: 'order-confirmed', to, payload, dedupeKey: key });

    expect(await outboxRows([key])).toHaveLength(1);
    expect(await outboxRow(key)).toMatchObject({
      template: 'order-confirmed',
      toAddress: to,
      status: 'pending',
      subject: 'Your green coffee order is confirmed',
    });
  });

  it("refuses a payload that does not fit its template, so the caller's transaction fails instead of the e-mail", async () => {
    await expect(
      // @ts-expect-error: rest-day needs readyFrom and brewMethod
      queueEmail(getTestDb(), { template: 'rest-day', to: testAddress('bad'), payload: { orderId: 'x' }, dedupeKey: `rest-day:${randomUUID()}` }),
    ).rejects.toThrow(ZodError);
    await expect(
      queueEmail(getTestDb(), { template: 'rest-day', to: 'not an address', payload: restDayPayload('x'), dedupeKey: `rest-day:${randomUUID()}` }),
    ).rejects.toThrow(/not an e-mail address/);
  });
});

describe('the outbox relay', () => {
  it('sends a committed row as HTML and text, marks it sent, and a restarted relay sends nothing again', async () => {
    const to = testAddress('relay');
    const key = `rest-day:${randomUUID()}`;
    await getTestDb().transaction((tx) => queueEmail(tx, { template: 'rest-day', to, payload: restDayPayload(randomUUID()), dedupeKey: key }));

    const first = relayForTest();
    await first.relay.relayOnce();
    const row = await outboxRow(key);
    expect(row).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
    expect(row?.sentAt).toBeInstanceOf(Date);

    const [email, ...others] = await inboxOf(mailCatcherUrl, to);
    expect(others).toEqual([]);
    expect(email?.subject).toBe('Your coffee is ready to brew');
    expect(email?.html).toContain('Keraba Ridge');
    expect(email?.html).toContain('12 Old Mill Way');
    expect(email?.text).toContain('Ready to brew from: Thursday, December 10, 2026');
    expect(String(email?.headers['message-id'])).toContain(row?.id);

    // A new relay (a restarted process) finds nothing to do: sent rows are never claimed again.
    const second = relayForTest();
    await second.relay.relayOnce();
    await first.relay.relayOnce();
    expect(await inboxOf(mailCatcherUrl, to)).toHaveLength(1);
    expect(await outboxRow(key)).toMatchObject({ status: 'sent', attempts: 1 });
  });

  it('takes over a row whose relay died mid-send once its lease has run out, and leaves a live lease alone', async () => {
    const [deadTo, liveTo] = [testAddress('lease-dead'), testAddress('lease-live')];
    const [deadKey, liveKey] = [`rest-day:${randomUUID()}`, `rest-day:${randomUUID()}`];
    await queueEmail(getTestDb(), { template: 'rest-day', to: deadTo, payload: restDayPayload(randomUUID()), dedupeKey: deadKey });
    await queueEmail(getTestDb(), { template: 'rest-day', to: liveTo, payload: restDayPayload(randomUUID()), dedupeKey: liveKey });
    // As a relay leaves them when it claimed them and then crashed: 'sending', with the lease in send_after.
    await getTestDb().execute(
      sql`update ${emailOutbox} set status = 'sending', attempts = 1, send_after = now() - interval '1 second' where dedupe_key = ${deadKey}`,
    );
    await getTestDb().execute(
      sql`update ${emailOutbox} set status = 'sending', attempts = 1, send_after = now() + interval '1 minute' where dedupe_key = ${liveKey}`,
    );

    await relayForTest().relay.relayOnce();

    expect(await outboxRow(deadKey)).toMatchObject({ status: 'sent', attempts: 2 });
    expect(await inboxOf(mailCatcherUrl, deadTo)).toHaveLength(1);
    expect(await outboxRow(liveKey)).toMatchObject({ status: 'sending', attempts: 1 });
    expect(await inboxOf(mailCatcherUrl, liveTo)).toEqual([]);
    await getTestDb().execute(sql`update ${emailOutbox} set status = 'failed' where dedupe_key = ${liveKey}`);
  });

  it('retries with backoff while SMTP refuses, then leaves the row failed (the dead letter) in the Outbox', async () => {
    const to = testAddress('dead-letter');
    const key = `rest-day:${randomUUID()}`;
    await queueEmail(getTestDb(), { template: 'rest-day', to, payload: restDayPayload(randomUUID()), dedupeKey: key });
    // Port 9 (discard) is closed on loopback: every attempt is refused.
    const { relay } = relayForTest({ smtpUrl: 'smtp://127.0.0.1:9', policy: { maxAttempts: 3, baseDelayMs: 300, maxDelayMs: 300 } });

    expect(await relay.relayOnce()).toMatchObject({ retrying: 1 });
    const afterFirst = await outboxRow(key);
    expect(afterFirst).toMatchObject({ status: 'pending', attempts: 1 });
    expect(afterFirst?.lastError).toMatch(/ECONNREFUSED|connect/i);
    // Backoff: the retry is not due yet, so an immediate pass leaves it alone.
    await relay.relayOnce();
    expect(await outboxRow(key)).toMatchObject({ status: 'pending', attempts: 1 });

    await waitFor(
      async () => {
        await relay.relayOnce();
        return outboxRow(key);
      },
      (row) => row?.status === 'failed',
      10_000,
      'the row to be given up',
    );
    expect(await outboxRow(key)).toMatchObject({ status: 'failed', attempts: 3 });
    // A failed row stays failed: no relay picks it up again.
    await relayForTest().relay.relayOnce();
    expect(await inboxOf(mailCatcherUrl, to)).toEqual([]);
    expect(await outboxRow(key)).toMatchObject({ status: 'failed', attempts: 3 });

    // Staff see it in the Outbox, with why it failed.
    const app = createTestApp();
    const staff = await signedInAgent(app, await createTestUser('staff'));
    const { items } = outboxListResponseSchema.parse((await staff.get('/api/roastery/outbox?status=failed&limit=500')).body);
    const item = items.find((candidate) => candidate.to === to);
    expect(item).toMatchObject({ template: 'rest-day', status: 'failed', attempts: 3 });
    expect(item?.lastError).toMatch(/ECONNREFUSED|connect/i);
  });

  it('gives up at once on a row whose payload no template can render (e.g. one written without queueEmail)', async () => {
    const key = `rest-day:${randomUUID()}`;
    await getTestDb()
      .insert(emailOutbox)
      .values({
        template: 'rest-day',
        toAddress: testAddress('unrenderable'),
        subject: 'Your coffee is ready to brew',
        payload: { orderId: 'x' },
        dedupeKey: key,
      });
    await relayForTest().relay.relayOnce();
    const row = await outboxRow(key);
    expect(row).toMatchObject({ status: 'failed', attempts: 1 });
    expect(row?.lastError).toMatch(/^cannot render/);
  });

  it('holds a message until its sendAfter by the Clock, so moving the test clock releases it', async () => {
    const clock = createAdjustableClock();
    const to = testAddress('scheduled');
    const key = `rest-day:${randomUUID()}`;
    await queueEmail(getTestDb(), {
      template: 'rest-day',
      to,
      payload: restDayPayload(randomUUID()),
      dedupeKey: key,
      sendAfter: new Date(Date.now() + 3 * DAY_MS),
    });
    const { relay } = relayForTest({ smtpUrl, clock });

    await relay.relayOnce();
    expect(await outboxRow(key)).toMatchObject({ status: 'pending', attempts: 0 });

    clock.set(new Date(Date.now() + 3 * DAY_MS + 60_000));
    await relay.relayOnce();
    expect(await outboxRow(key)).toMatchObject({ status: 'sent', attempts: 1 });
    expect(await inboxOf(mailCatcherUrl, to)).toHaveLength(1);
  });
});

describe('GET /api/roastery/outbox', () => {
  const app = createTestApp();
  const people = {} as Record<'customer' | 'staff' | 'owner', TestUser>;
  const keys = { sent: `rest-day:${randomUUID()}`, failed: `rest-day:${randomUUID()}`, pending: `rest-day:${randomUUID()}` };

  beforeAll(async () => {
    for (const role of ['customer', 'staff', 'owner'] as const) people[role] = await createTestUser(role);
    // Three rows a second apart: sent (oldest), failed, pending (newest).
    const base = Date.now() - 10_000;
    const row = (key: string, n: number, extra: Partial<typeof emailOutbox.$inferInsert>) => ({
      template: 'rest-day',
      toAddress: people.customer.email,
      subject: 'Your coffee is ready to brew',
      payload: restDayPayload(randomUUID()),
      dedupeKey: key,
      createdAt: new Date(base + n * 1000),
      sendAfter: new Date(Date.now() + 365 * DAY_MS),
      ...extra,
    });
    await getTestDb()
      .insert(emailOutbox)
      .values([
        row(keys.sent, 0, { status: 'sent', attempts: 1, sentAt: new Date(base + 500) }),
        row(keys.failed, 1, { status: 'failed', attempts: 10, lastError: 'connect ECONNREFUSED 127.0.0.1:25' }),
        row(keys.pending, 2, { status: 'pending' }),
      ]);
  });

  const signedIn = (role: keyof typeof people) => signedInAgent(app, people[role]);

  it('refuses anyone not signed in, and customers', async () => {
    const anonymous = await request(app).get('/api/roastery/outbox');
    expect(anonymous.status).toBe(401);
    expect(apiErrorSchema.parse(anonymous.body).error.code).toBe('sign_in_required');
    const customer = await (await signedIn('customer')).get('/api/roastery/outbox');
    expect(customer.status).toBe(403);
  });

  it.each(['staff', 'owner'] as const)('shows %s the e-mails newest first, with the dead letters and their last error', async (role) => {
    const agent = await signedIn(role);
    const response = await agent.get('/api/roastery/outbox?limit=500');
    expect(response.status).toBe(200);
    const { items } = outboxListResponseSchema.parse(response.body);
    const mine = items.filter((item) => item.to === people.customer.email);
    expect(mine.map((item) => item.status)).toEqual(['pending', 'failed', 'sent']);
    expect(mine[1]).toMatchObject({ template: 'rest-day', attempts: 10, lastError: 'connect ECONNREFUSED 127.0.0.1:25' });
    expect(mine[2]?.sentAt).toBeDefined();
    expect(mine[0]?.sentAt).toBeUndefined();
    const times = items.map((item) => item.createdAt);
    expect(times).toEqual([...times].sort().reverse());
  });

  it('filters by status and refuses an unknown one', async () => {
    const agent = await signedIn('staff');
    const failed = outboxListResponseSchema.parse((await agent.get('/api/roastery/outbox?status=failed&limit=500')).body).items;
    expect(failed.length).toBeGreaterThan(0);
    expect(failed.every((item) => item.status === 'failed')).toBe(true);
    expect(failed.some((item) => item.to === people.customer.email)).toBe(true);
    const bad = await agent.get('/api/roastery/outbox?status=lost');
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toHaveProperty('status');
  });
});

describe('POST /api/dev/clock', () => {
  const post = (app: ReturnType<typeof createApp>, body: unknown) =>
    request(app)
      .post('/api/dev/clock')
      .set('X-Restday-Client', 'web')
      .send(body as object);

  it('does not exist unless the server runs with RESTDAY_TEST_CLOCK on', async () => {
    expect((await post(createTestApp(), { now: new Date().toISOString() })).status).toBe(404);
  });

  it('refuses to build an app with the test clock on but a clock that cannot move', () => {
    const config = testConfig({ RESTDAY_TEST_CLOCK: 'true' });
    expect(() => createApp({ config, database: getTestDatabase(), logger: createLogger(config), clock: { now: () => new Date() } })).toThrow(
      /adjustable clock/,
    );
  });

  it('moves the clock the workers read: a rest-day e-mail due in five days arrives at once', async () => {
    const config = testConfig({ RESTDAY_TEST_CLOCK: 'true', SMTP_URL: smtpUrl, DATABASE_URL: inject('databaseUrl') });
    const logger = createLogger(config);
    const clock = createAdjustableClock();
    const queue = await startQueue(config.DATABASE_URL, logger);
    const workers = await startWorkers({ config, database: getTestDatabase(), queue, clock, logger, relayPollMs: 200 });
    onTestFinished(async () => {
      await workers.stop();
      await queue.stop();
    });
    const app = createApp({ config, database: getTestDatabase(), logger, clock, queue });

    const to = testAddress('dev-clock');
    const readyAt = new Date(Date.now() + 5 * DAY_MS);
    await getTestDb().transaction((tx) =>
      queueEmail(tx, { template: 'rest-day', to, payload: restDayPayload(randomUUID()), dedupeKey: `rest-day:${randomUUID()}`, sendAfter: readyAt }),
    );
    await new Promise((resolve) => setTimeout(resolve, 600));
    expect(await inboxOf(mailCatcherUrl, to)).toEqual([]);

    const bad = await post(app, { now: 'next tuesday' });
    expect(bad.status).toBe(400);
    expect(apiErrorSchema.parse(bad.body).error.fields).toHaveProperty('now');

    const moved = await post(app, { now: new Date(readyAt.getTime() + 60_000).toISOString() });
    expect(moved.status).toBe(200);
    expect(new Date(devClockResponseSchema.parse(moved.body).now).getTime()).toBeGreaterThanOrEqual(readyAt.getTime());
    expect(clock.now().getTime()).toBeGreaterThanOrEqual(readyAt.getTime());

    const inbox = await waitFor(
      () => inboxOf(mailCatcherUrl, to),
      (emails) => emails.length > 0,
      5000,
      'the rest-day e-mail',
    );
    expect(inbox).toHaveLength(1);
    expect((await request(app).get('/api/health')).body).toMatchObject({ ok: true, queue: 'up' });
  });
});

describe('a committed e-mail through the workers', () => {
  it('arrives promptly after commit (woken by NOTIFY, well before any slow poll)', async () => {
    const config = testConfig({ SMTP_URL: smtpUrl, DATABASE_URL: inject('databaseUrl') });
    const logger = createLogger(config);
    const queue = await startQueue(config.DATABASE_URL, logger);
    // A poll of a minute: only the notification can make this e-mail leave within the test's wait.
    const workers = await startWorkers({ config, database: getTestDatabase(), queue, clock: createAdjustableClock(), logger, relayPollMs: 60_000 });
    onTestFinished(async () => {
      await workers.stop();
      await queue.stop();
    });
    await workers.relay.idle();
    await new Promise((resolve) => setTimeout(resolve, 300)); // the listener connects

    const to = testAddress('notify');
    const started = Date.now();
    await getTestDb().transaction((tx) =>
      queueEmail(tx, {
        template: 'password-reset',
        to,
        payload: { name: 'Test Customer', resetUrl: 'http://127.0.0.1:3000/reset-password?token=t', expiresAt: new Date(Date.now() + 3_600_000) },
        dedupeKey: `password-reset:${randomUUID()}`,
      }),
    );
    const [email] = await waitFor(
      () => inboxOf(mailCatcherUrl, to),
      (emails) => emails.length > 0,
      5000,
      'the password-reset e-mail',
    );
    expect(Date.now() - started).toBeLessThan(5000);
    expect(email?.subject).toBe('Reset your password');
  });
});
