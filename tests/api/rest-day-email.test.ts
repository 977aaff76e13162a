import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { instantAt } from '@shared/domain/shop-time';
import { devClockResponseSchema } from '@shared/schemas/dev-clock';
import { orders } from '../../server/db/schema/index';
import { createDatabase } from '../../server/db/client';
import { startQueue, type Queue } from '../../server/jobs/queue';
import { sendJob } from '../../server/jobs/registry';
import { restDayEmailsJob } from '../../server/jobs/rest-day-emails';
import { startWorkers, type Workers } from '../../server/jobs/workers';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { loadShopSettings } from '../../server/modules/settings/settings.repo';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { inboxOf, outboxRows, testConfig, waitFor } from './outbox-support';
import { createLotForSale, createRoastedOrder, createTestUser, dayAfter, recordBatch, type TestUser, uniqueDay } from '../factories/index';

const databaseUrl = inject('databaseUrl');
const mailCatcherUrl = inject('mailCatcherUrl');
// One test clock shared by the app (moved through POST /api/dev/clock) and this process's workers.
const clock = createAdjustableClock();
const app = createTestApp({ env: { RESTDAY_TEST_CLOCK: 'true' }, clock });
const config = testConfig({ DATABASE_URL: databaseUrl, SMTP_URL: inject('smtpUrl'), RESTDAY_TEST_CLOCK: 'true' });
const database = createDatabase({ url: databaseUrl, poolMax: 3, connectTimeoutMs: 2000 });
let queue: Queue;
let workers: Workers;
let staffMember: TestUser;

beforeAll(async () => {
  queue = await startQueue(databaseUrl, createLogger(config));
  workers = await startWorkers({ config, database, queue, clock, logger: createLogger(config), relayPollMs: 200 });
  staffMember = await createTestUser('staff');
});

afterAll(async () => {
  await workers.stop();
  await queue.stop();
  await database.close();
});

/**
 * Moves the test clock to `time` (shop-local) on `date`, through the API as a test or demo would
 * (open to any caller on a test server; sessions follow the clock, so sign in after a move).
 */
async function moveClockTo(date: string, time: string) {
  const { settings } = await loadShopSettings(getTestDb());
  const response = await request(app)
    .post('/api/dev/clock')
    .set('X-Restday-Client', 'web')
    .send({ now: instantAt(date, time, settings.timeZone).toISOString() });
  expect(response.status).toBe(200);
}

/** Queues one run of the job on pg-boss and waits until a worker has finished it. */
async function runRestDayJob() {
  const id = await sendJob(queue, restDayEmailsJob, {});
  await waitFor(
    () => queue.boss.getJobById(restDayEmailsJob.name, id!),
    (job) => job?.state === 'completed',
    20_000,
    'the rest-day job to run',
  );
}

const readySubject = 'Your coffee is ready to brew';
const readyMail = async (customer: TestUser) => (await inboxOf(mailCatcherUrl, customer.email)).filter((mail) => mail.subject === readySubject);

describe('the rest-day e-mail job', () => {
  it('sends the rest-day e-mail once on the ready-from morning, never for a cancelled or refunded order, and nothing more when the clock moves on', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    const readyFrom = dayAfter(roastDate, 4);
    await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 5000 });
    const [kept, cancelled, refunded] = [await createTestUser('customer'), await createTestUser('customer'), await createTestUser('customer')];
    const placed = [];
    for (const customer of [kept, cancelled, refunded]) {
      placed.push(
        await createRoastedOrder(customer.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 1, roastLevel: 'medium', brewMethod: 'filter' }] }),
      );
    }
    expect(placed.map((order) => order.readyFrom)).toEqual([readyFrom, readyFrom, readyFrom]);

    // Packed and shipped the day after roasting.
    await moveClockTo(dayAfter(roastDate, 1), '10:00');
    const staff = await signedInAgent(app, staffMember);
    for (const order of placed) {
      expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);
      expect((await staff.post(`/api/orders/${order.id}/ship`).send({ carrier: 'Invented Parcel Co', trackingNumber: 'RD123' })).status).toBe(200);
    }
    await getTestDb().update(orders).set({ status: 'cancelled' }).where(eq(orders.id, placed[1]!.id));
    await getTestDb().update(orders).set({ status: 'refunded', refundedCents: 1500 }).where(eq(orders.id, placed[2]!.id));
    const keys = placed.map((order) => `rest-day:${order.id}`);

    // The evening before, and early on the ready-from day: not yet.
    await moveClockTo(dayAfter(readyFrom, -1), '20:00');
    await runRestDayJob();
    await moveClockTo(readyFrom, '07:30');
    await runRestDayJob();
    expect(await outboxRows(keys)).toEqual([]);

    // The ready-from morning: one e-mail, for the order still shipped.
    await moveClockTo(readyFrom, '09:00');
    await runRestDayJob();
    const arrived = await waitFor(
      () => readyMail(kept),
      (mail) => mail.length > 0,
      10_000,
      'the rest-day e-mail',
    );
    expect(arrived).toHaveLength(1);
    expect(arrived[0]!.text).toContain(lot.name);
    expect((await outboxRows(keys)).map((row) => row.dedupeKey)).toEqual([keys[0]]);

    // The next morning, and a run again: nothing more.
    await moveClockTo(dayAfter(readyFrom, 1), '09:00');
    await runRestDayJob();
    await runRestDayJob();
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(await readyMail(kept)).toHaveLength(1);
    expect(await readyMail(cancelled)).toEqual([]);
    expect(await readyMail(refunded)).toEqual([]);
    expect(await outboxRows(keys)).toHaveLength(1);
  });

  it('runs by itself when the test clock moves past the ready-from morning: the e-mail arrives within seconds, once', async () => {
    // This app queues the jobs a clock move makes due, as `npm start` with the test clock does.
    const appWithQueue = createTestApp({ env: { RESTDAY_TEST_CLOCK: 'true' }, clock, queue });
    const { settings } = await loadShopSettings(getTestDb());
    const move = async (date: string, time: string) => {
      const response = await request(appWithQueue)
        .post('/api/dev/clock')
        .set('X-Restday-Client', 'web')
        .send({ now: instantAt(date, time, settings.timeZone).toISOString() });
      expect(response.status).toBe(200);
      return devClockResponseSchema.parse(response.body);
    };
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    const readyFrom = dayAfter(roastDate, 4);
    await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 5000 });
    const customer = await createTestUser('customer');
    const order = await createRoastedOrder(customer.id, {
      roastDate,
      lines: [{ lotId: lot.id, size: '12oz', quantity: 1, roastLevel: 'medium', brewMethod: 'filter' }],
    });
    expect(order.readyFrom).toBe(readyFrom);

    await move(dayAfter(roastDate, 1), '10:00');
    const staff = await signedInAgent(appWithQueue, staffMember);
    expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);
    expect((await staff.post(`/api/orders/${order.id}/ship`).send({ carrier: 'Invented Parcel Co', trackingNumber: 'RD124' })).status).toBe(200);

    // The job runs every ten minutes (its cron), so a move across the ready-from morning makes it due.
    const moved = await move(readyFrom, '09:00');
    expect(moved.dueJobs).toContain(restDayEmailsJob.name);
    const arrived = await waitFor(
      () => readyMail(customer),
      (mail) => mail.length > 0,
      10_000,
      'the rest-day e-mail after the clock move',
    );
    expect(arrived).toHaveLength(1);

    // Moving on again runs the job again (its queue drains), and it sends nothing twice.
    const again = await move(readyFrom, '11:00');
    expect(again.dueJobs).toContain(restDayEmailsJob.name);
    await waitFor(
      () => pendingRestDayJobs(),
      (count) => count === 0,
      20_000,
      'the rest-day jobs to finish',
    );
    await waitFor(
      () => outboxRows([`rest-day:${order.id}`]),
      (rows) => rows.every((row) => row.status === 'sent'),
      10_000,
      'the outbox to settle',
    );
    expect(await readyMail(customer)).toHaveLength(1);
    expect(await outboxRows([`rest-day:${order.id}`])).toHaveLength(1);
  });
});

/** Rest-day jobs queued on pg-boss and not yet finished. */
async function pendingRestDayJobs(): Promise<number> {
  const result = await getTestDb().execute<{ count: string }>(
    sql`select count(*) as count from pgboss.job where name = ${restDayEmailsJob.name} and state in ('created', 'retry', 'active')`,
  );
  return Number(result.rows[0]?.count ?? 0);
}
