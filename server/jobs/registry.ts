import cronParser from 'cron-parser';
import type PgBoss from 'pg-boss';
import type { Config } from '../config';
import type { Db } from '../db/client';
import type { Clock } from '../lib/clock';
import type { Logger } from '../lib/logger';
import type { Queue } from './queue';

/** What every job handler gets. Handlers read time from `clock` (the test clock moves it), never `new Date()`. */
export interface JobContext {
  db: Db;
  clock: Clock;
  logger: Logger;
  config: Config;
}

export interface JobRun {
  id: string;
  /** 0 on the first try. */
  retryCount: number;
}

/**
 * A background job on pg-boss. pg-boss hands each job to one worker at a time (SELECT … FOR UPDATE
 * SKIP LOCKED), retries a throwing handler `retryLimit` times with exponential backoff, and then
 * moves a copy to the `dead-letter` queue. Handlers must still be idempotent: a job whose worker
 * died mid-run is run again once it expires.
 */
export interface JobDefinition<Data extends object> {
  /** Queue name: lower-case words and dashes, e.g. `renewal-reminders`. */
  name: string;
  run(data: Data, context: JobContext, job: JobRun): Promise<void>;
  retryLimit?: number;
  /** First retry after this many seconds; doubles each retry when `retryBackoff` (default true). */
  retryDelaySeconds?: number;
  retryBackoff?: boolean;
  /** A run taking longer is treated as failed (and retried). */
  expireInSeconds?: number;
  /** Workers for this job in each process (default: the process's own setting, else 1). */
  concurrency?: number;
  /**
   * Jobs each worker takes per fetch (default 1). pg-boss waits its polling interval between
   * fetches, so a job that comes in bursts takes several at a time and a short interval.
   */
  batchSize?: number;
  pollingIntervalSeconds?: number;
  /** A recurring job: cron in the shop's time zone (`tz`), e.g. `{cron: '0 7 * * *', tz: 'America/Denver'}`. */
  schedule?: { cron: string; tz?: string; data?: Data };
}

export function defineJob<Data extends object>(definition: JobDefinition<Data>): JobDefinition<Data> {
  return definition;
}

/** Where pg-boss copies a job that failed its last retry. */
export const DEAD_LETTER_QUEUE = 'dead-letter';

const defaults = { retryLimit: 5, retryDelaySeconds: 30, retryBackoff: true, expireInSeconds: 15 * 60 };

// Job definitions are stored with their own data type; the registry only passes data through.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyJob = JobDefinition<any>;

/** Creates (or updates) each job's queue with its retry policy. Safe to run from every process. */
export async function ensureJobQueues(boss: PgBoss, jobs: readonly AnyJob[]): Promise<void> {
  await boss.createQueue(DEAD_LETTER_QUEUE, { name: DEAD_LETTER_QUEUE, retentionMinutes: 60 * 24 * 14 });
  for (const job of jobs) {
    const options = {
      name: job.name,
      retryLimit: job.retryLimit ?? defaults.retryLimit,
      retryDelay: job.retryDelaySeconds ?? defaults.retryDelaySeconds,
      retryBackoff: job.retryBackoff ?? defaults.retryBackoff,
      expireInSeconds: job.expireInSeconds ?? defaults.expireInSeconds,
      deadLetter: DEAD_LETTER_QUEUE,
    };
    await boss.createQueue(job.name, options);
    await boss.updateQueue(job.name, options);
  }
}

/** Queues one run of `job` (optionally not before `startAfter`, by the database's clock). */
export async function sendJob<Data extends object>(
  queue: Queue,
  job: JobDefinition<Data>,
  data: Data,
  options: { startAfter?: Date; singletonKey?: string } = {},
): Promise<string> {
  const jobId = await queue.boss.send(job.name, data, {
    ...(options.startAfter ? { startAfter: options.startAfter } : {}),
    ...(options.singletonKey ? { singletonKey: options.singletonKey } : {}),
  });
  // pg-boss answers null, not an error, for a queue that does not exist: the job would be lost.
  if (jobId === null) throw new Error(`The job queue ${job.name} does not exist, so the job was not queued.`);
  return jobId;
}

/** Starts this process's workers for `jobs` and their schedules; returns a function that stops them. */
export async function workJobs(
  queue: Queue,
  jobs: readonly AnyJob[],
  context: JobContext,
  options: { pollingIntervalSeconds?: number; /** Workers per job in this process (default 1). */ concurrency?: number } = {},
): Promise<() => Promise<void>> {
  const { boss } = queue;
  await ensureJobQueues(boss, jobs);
  for (const job of jobs) {
    for (let n = 0; n < (job.concurrency ?? options.concurrency ?? 1); n++) {
      const batchSize = job.batchSize ?? 1;
      const pollingIntervalSeconds = job.pollingIntervalSeconds ?? options.pollingIntervalSeconds ?? 2;
      await boss.work<object>(job.name, { batchSize, includeMetadata: true, pollingIntervalSeconds }, async (batch) => {
        for (const next of batch) {
          const log = context.logger.child({ job: job.name, jobId: next.id });
          try {
            await job.run(next.data, { ...context, logger: log }, { id: next.id, retryCount: next.retryCount });
          } catch (error) {
            log.warn({ err: error, retryCount: next.retryCount }, 'job failed');
            if (batchSize === 1) throw error;
            // One failure must not fail the rest of the batch: pg-boss completes only the jobs still active.
            await boss.fail(job.name, next.id, { message: error instanceof Error ? error.message : String(error) });
          }
        }
      });
    }
    if (job.schedule) await boss.schedule(job.name, job.schedule.cron, job.schedule.data ?? {}, job.schedule.tz ? { tz: job.schedule.tz } : {});
  }
  return async () => {
    for (const job of jobs) await boss.offWork(job.name);
  };
}

/**
 * The scheduled jobs whose cron fires at least once after `from` and at or before `to`: what the
 * schedule would have run had the clock moved through that span. A move backwards is due nothing.
 */
export function jobsDueBetween(jobs: readonly AnyJob[], from: Date, to: Date): AnyJob[] {
  if (to.getTime() <= from.getTime()) return [];
  return jobs.filter((job) => {
    if (!job.schedule) return false;
    const next = cronParser.parseExpression(job.schedule.cron, { currentDate: from, ...(job.schedule.tz ? { tz: job.schedule.tz } : {}) }).next();
    return next.getTime() <= to.getTime();
  });
}

/** Queues one run of each scheduled job due between two instants (after a test clock move). */
export async function sendJobsDueBetween(queue: Queue, jobs: readonly AnyJob[], from: Date, to: Date): Promise<string[]> {
  const due = jobsDueBetween(jobs, from, to);
  for (const job of due) await queue.boss.send(job.name, job.schedule?.data ?? {});
  return due.map((job) => job.name);
}
