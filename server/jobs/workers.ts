import type { Config } from '../config';
import type { Database } from '../db/client';
import { createMailer, type Mailer } from '../integrations/mailer';
import type { Clock } from '../lib/clock';
import type { Logger } from '../lib/logger';
import { CLOCK_CHANNEL, followClockBroadcasts } from '../modules/dev-clock/dev-clock.service';
import { createOutboxRepo, OUTBOX_CHANNEL } from '../modules/outbox/outbox.repo';
import { createOutboxRelay, type RelayPolicy } from '../modules/outbox/outbox.service';
import { startListener } from './listener';
import { startRelayRunner, type RelayRunner } from './outbox-relay';
import type { Queue } from './queue';
import { applyPaymentEventJob, paymentEventsSweepJob } from './payment-events';
import { restDayEmailsJob } from './rest-day-emails';
import { workJobs, type JobDefinition } from './registry';
import { renewalRemindersJob } from './renewal-reminders';
import { subscriptionStripeSyncJob } from './subscription-stripe-sync';
import { unpaidOrdersJob } from './unpaid-orders';

/**
 * Every background job Restday runs on pg-boss. Later features add theirs here (defineJob in
 * ./registry). The outbox relay is not among them: it runs beside them (see startWorkers).
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const jobs: JobDefinition<any>[] = [
  renewalRemindersJob,
  subscriptionStripeSyncJob,
  restDayEmailsJob,
  applyPaymentEventJob,
  paymentEventsSweepJob,
  unpaidOrdersJob,
];

export interface WorkerDeps {
  config: Config;
  database: Database;
  queue: Queue;
  clock: Clock;
  logger: Logger;
  /** Defaults to nodemailer over config.SMTP_URL. */
  mailer?: Mailer;
  relayPolicy?: Partial<RelayPolicy>;
  /** How often the relay looks for due rows without a notification (default 1000 ms). */
  relayPollMs?: number;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  extraJobs?: JobDefinition<any>[];
}

export interface Workers {
  relay: RelayRunner;
  stop(): Promise<void>;
}

/**
 * The queue workers of one process: pg-boss job handlers, and the outbox relay woken by
 * `queueEmail`'s NOTIFY and a short poll. Run inside the server (the default) and/or in any number
 * of `npm run worker` processes: rows and jobs are claimed so that no two of them take the same one.
 */
export async function startWorkers(deps: WorkerDeps): Promise<Workers> {
  const { config, database, queue, clock, logger } = deps;
  const log = logger.child({ component: 'workers' });
  const mailer = deps.mailer ?? createMailer(config);
  const relay = startRelayRunner(
    createOutboxRelay({ repo: createOutboxRepo(database.db), mailer, clock, logger: log, config, ...(deps.relayPolicy ? { policy: deps.relayPolicy } : {}) }),
    log,
    { pollMs: deps.relayPollMs ?? 1000 },
  );
  const channels: Record<string, (payload: string) => void> = { [OUTBOX_CHANNEL]: () => relay.kick() };
  // With the test clock on, a move made through any server's POST /api/dev/clock reaches this process too.
  if (config.RESTDAY_TEST_CLOCK) channels[CLOCK_CHANNEL] = followClockBroadcasts(clock, () => relay.kick());
  const listener = startListener({ databaseUrl: config.DATABASE_URL, logger: log, channels, onReconnect: () => relay.kick() });
  let stopJobs: () => Promise<void>;
  try {
    stopJobs = await workJobs(queue, [...jobs, ...(deps.extraJobs ?? [])], { db: database.db, clock, logger: log, config });
  } catch (error) {
    await listener.stop();
    await relay.stop();
    if (!deps.mailer) mailer.close();
    throw error;
  }

  return {
    relay,
    async stop() {
      await stopJobs();
      await listener.stop();
      await relay.stop();
      if (!deps.mailer) mailer.close();
    },
  };
}
