import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { demoEmailPayloads } from '../../emails/demo';
import { startMailCatcher, type MailCatcher } from '../../dev-services/mail-catcher';
import { startQueue } from '../../server/jobs/queue';
import { startWorkers } from '../../server/jobs/workers';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { queueEmail } from '../../server/modules/outbox/outbox.repo';
import { getTestDatabase, getTestDb } from '../setup/test-db';
import { inboxOf, outboxRows, testConfig, waitFor } from '../api/outbox-support';
import { testAddress } from '../factories/index';

// This file's own mail catcher, on ports of its own, so stopping it disturbs no other test.
const smtpPort = Number(process.env.RESTDAY_TEST_OUTAGE_SMTP_PORT ?? 1035);
const webPort = Number(process.env.RESTDAY_TEST_OUTAGE_MAILDEV_WEB_PORT ?? 1095);
const mailDir = mkdtempSync(path.join(tmpdir(), 'restday-outage-mail-'));
const config = testConfig({ DATABASE_URL: inject('databaseUrl'), SMTP_URL: `smtp://127.0.0.1:${smtpPort}` });
const logger = createLogger(config);

let catcher: MailCatcher | undefined;
const stops: (() => Promise<void>)[] = [];
afterAll(async () => {
  for (const stop of stops.reverse()) await stop();
  await catcher?.stop();
  rmSync(mailDir, { recursive: true, force: true });
});

/** As the payment webhook does: the order change and its e-mail in one transaction. */
async function payOrder(to: string) {
  const orderId = randomUUID();
  const dedupeKey = `order-confirmed:${orderId}`;
  await getTestDb().transaction((tx) =>
    queueEmail(tx, { template: 'order-confirmed', to, payload: { ...demoEmailPayloads['order-confirmed'], orderId }, dedupeKey }),
  );
  return dedupeKey;
}

describe('when the mail catcher stops while orders are paid and starts again', () => {
  // Starts its own mail catcher twice: a cold start on a busy machine takes seconds each.
  it('delivers every e-mail queued meanwhile, each exactly once', { timeout: 120_000 }, async () => {
    catcher = await startMailCatcher({ smtpPort, webPort, mailDir });
    const queue = await startQueue(config.DATABASE_URL, logger);
    const workers = await startWorkers({
      config,
      database: getTestDatabase(),
      queue,
      clock: createAdjustableClock(),
      logger,
      relayPollMs: 100,
      // Quick retries, and enough of them to outlast the outage.
      relayPolicy: { baseDelayMs: 100, maxDelayMs: 500, maxAttempts: 100 },
    });
    stops.push(async () => {
      await workers.stop();
      await queue.stop();
    });

    // Before the outage, mail flows.
    const before = testAddress('before-outage');
    await payOrder(before);
    await waitFor(
      () => inboxOf(catcher!.webUrl, before),
      (emails) => emails.length === 1,
      10_000,
      'the first e-mail',
    );

    await catcher.stop();
    catcher = undefined;
    const recipients = Array.from({ length: 6 }, (_, n) => testAddress(`outage-${n}`));
    const keys: string[] = [];
    for (const to of recipients) keys.push(await payOrder(to));

    // Every row is tried, refused, and waiting for its retry; none is lost or given up.
    const waiting = await waitFor(
      () => outboxRows(keys),
      (rows) => rows.length === keys.length && rows.every((row) => row.attempts >= 2 && row.status !== 'sent'),
      15_000,
      'every row to have failed twice',
    );
    expect(waiting.every((row) => row.status === 'pending' || row.status === 'sending')).toBe(true);
    expect(waiting.some((row) => /ECONNREFUSED|connect/i.test(row.lastError ?? ''))).toBe(true);

    catcher = await startMailCatcher({ smtpPort, webPort, mailDir });
    const webUrl = catcher.webUrl;
    const sent = await waitFor(
      () => outboxRows(keys),
      (rows) => rows.every((row) => row.status === 'sent'),
      20_000,
      'every row sent',
    );
    expect(sent.every((row) => row.sentAt !== null)).toBe(true);

    await new Promise((resolve) => setTimeout(resolve, 1000)); // time for any duplicate to arrive
    for (const to of recipients) {
      const inbox = await inboxOf(webUrl, to);
      expect(inbox).toHaveLength(1);
      expect(inbox[0]?.subject).toBe('Your green coffee order is confirmed');
    }
    expect(await inboxOf(webUrl, before)).toHaveLength(1);
  });
});
