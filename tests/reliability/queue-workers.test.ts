import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { demoEmailPayloads } from '../../emails/demo';
import { createDatabase, type Database } from '../../server/db/client';
import { createMailer, type Mailer } from '../../server/integrations/mailer';
import { startQueue, type Queue } from '../../server/jobs/queue';
import { DEAD_LETTER_QUEUE, defineJob, sendJob, workJobs, type JobContext } from '../../server/jobs/registry';
import { startWorkers } from '../../server/jobs/workers';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { queueEmail } from '../../server/modules/outbox/outbox.repo';
import { getTestDb } from '../setup/test-db';
import { inboxOf, outboxRows, testConfig, waitFor } from '../api/outbox-support';
import { testAddress } from '../factories/index';

const databaseUrl = inject('databaseUrl');
const smtpUrl = inject('smtpUrl');
const mailCatcherUrl = inject('mailCatcherUrl');
const config = testConfig({ DATABASE_URL: databaseUrl, SMTP_URL: smtpUrl });
const logger = createLogger(config);

const stops: (() => Promise<void>)[] = [];
afterAll(async () => {
  for (const stop of stops.reverse()) await stop();
});

/** A worker "process": its own pool and its own pg-boss, as `npm run worker` would have. */
async function workerProcess(): Promise<{ database: Database; queue: Queue; context: JobContext }> {
  const database = createDatabase({ url: databaseUrl, poolMax: 3, connectTimeoutMs: 2000 });
  const queue = await startQueue(databaseUrl, logger);
  stops.push(async () => {
    await queue.stop();
    await database.close();
  });
  return { database, queue, context: { db: database.db, clock: createAdjustableClock(), logger, config } };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe('two queue workers on the same jobs', () => {
  it('run each job exactly once, sharing the work', async () => {
    const [a, b] = [await workerProcess(), await workerProcess()];
    const runs: { n: number; worker: string }[] = [];
    const job = (worker: string) =>
      defineJob<{ n: number }>({
        name: `test-count-${randomUUID().slice(0, 8)}`,
        async run(data) {
          runs.push({ n: data.n, worker });
          await sleep(40);
        },
      });
    const onA = job('a');
    const onB = { ...job('b'), name: onA.name };
    const stopA = await workJobs(a.queue, [onA], a.context, { pollingIntervalSeconds: 0.5, concurrency: 2 });
    const stopB = await workJobs(b.queue, [onB], b.context, { pollingIntervalSeconds: 0.5, concurrency: 2 });
    stops.push(stopA, stopB);

    const count = 30;
    for (let n = 0; n < count; n++) await sendJob(a.queue, onA, { n });
    await waitFor(
      async () => runs.length,
      (length) => length >= count,
      20_000,
      'every job to run',
    );
    await sleep(1500); // time for any duplicate run to show up

    const ns = runs.map((run) => run.n).sort((x, y) => x - y);
    expect(ns).toEqual(Array.from({ length: count }, (_, n) => n));
    expect(new Set(runs.map((run) => run.worker))).toEqual(new Set(['a', 'b']));
  });

  it('retry a failing job with backoff and then move it to the dead-letter queue', async () => {
    const { queue, context } = await workerProcess();
    const attempts: number[] = [];
    const marker = randomUUID();
    const failing = defineJob<{ marker: string }>({
      name: `test-failing-${marker.slice(0, 8)}`,
      retryLimit: 2,
      retryDelaySeconds: 1,
      async run(_data, _context, job) {
        attempts.push(Date.now());
        throw new Error(`attempt ${job.retryCount + 1} fails`);
      },
    });
    stops.push(await workJobs(queue, [failing], context, { pollingIntervalSeconds: 0.5 }));
    await sendJob(queue, failing, { marker });

    const dead = await waitFor(
      async () => (await queue.boss.fetch<{ marker: string }>(DEAD_LETTER_QUEUE, { batchSize: 50 })).filter((job) => job.data.marker === marker),
      (jobs) => jobs.length > 0,
      20_000,
      'the job in the dead-letter queue',
    );
    expect(dead).toHaveLength(1);
    expect(attempts).toHaveLength(3);
    // Exponential backoff: the second wait is longer than the first.
    const [first = 0, second = 0, third = 0] = attempts;
    expect(second - first).toBeGreaterThanOrEqual(900);
    expect(third - second).toBeGreaterThan(second - first);
  });

  it('send each outbox e-mail exactly once when two relays work the same rows', async () => {
    const [a, b] = [await workerProcess(), await workerProcess()];
    const clock = createAdjustableClock();
    // Queue the rows first, then start both relays at once so they race for the same rows.
    const recipients = Array.from({ length: 24 }, (_, n) => testAddress(`race-${n}`));
    const keys = recipients.map(() => `order-confirmed:${randomUUID()}`);
    await getTestDb().transaction(async (tx) => {
      for (const [n, to] of recipients.entries()) {
        await queueEmail(tx, {
          template: 'order-confirmed',
          to,
          payload: { ...demoEmailPayloads['order-confirmed'], orderId: randomUUID() },
          dedupeKey: keys[n] as string,
        });
      }
    });
    // Each relay's mailer counts what it sent, then hands the message to the real SMTP server.
    const sentBy = { a: 0, b: 0 };
    const counting = (name: 'a' | 'b'): Mailer => {
      const real = createMailer(config);
      stops.push(async () => real.close());
      return {
        async send(message) {
          await real.send(message);
          sentBy[name] += 1;
        },
        close: () => undefined,
      };
    };
    const [workersA, workersB] = await Promise.all([
      startWorkers({ config, database: a.database, queue: a.queue, clock, logger, relayPollMs: 100, mailer: counting('a') }),
      startWorkers({ config, database: b.database, queue: b.queue, clock, logger, relayPollMs: 100, mailer: counting('b') }),
    ]);
    stops.push(
      () => workersA.stop(),
      () => workersB.stop(),
    );

    const rows = await waitFor(
      () => outboxRows(keys),
      (all) => all.every((row) => row.status === 'sent'),
      20_000,
      'every row sent',
    );
    expect(rows.map((row) => row.attempts)).toEqual(recipients.map(() => 1));
    await sleep(500);
    for (const to of recipients) expect(await inboxOf(mailCatcherUrl, to)).toHaveLength(1);
    // Both relays took part (other files' leftover rows may add to either count).
    expect(sentBy.a).toBeGreaterThan(0);
    expect(sentBy.b).toBeGreaterThan(0);
    expect(sentBy.a + sentBy.b).toBeGreaterThanOrEqual(recipients.length);
  });
});
