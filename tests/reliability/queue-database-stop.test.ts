import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { startCluster, testClusterOptions } from '../../dev-services/postgres';
import { startQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/lib/logger';
import { waitFor } from '../api/outbox-support';

// Stops the real test cluster mid-run, so this file restarts it (on the same port) whatever happens.
const { port } = startCluster(testClusterOptions());
const restartCluster = () => startCluster({ ...testClusterOptions(), port });
afterAll(() => {
  restartCluster();
});

describe('the job queue when PostgreSQL stops under a running job', () => {
  it('a job that ends (well or badly) after the database went away is reported as a queue error, and the process goes on', async () => {
    const lines: { msg: string; err?: { stack?: string } }[] = [];
    const logger = createLogger({ LOG_LEVEL: 'warn', NODE_ENV: 'test' }, { write: (line: string) => void lines.push(JSON.parse(line)) });
    const unhandled: unknown[] = [];
    const onUnhandled = (reason: unknown) => unhandled.push(reason);
    process.on('unhandledRejection', onUnhandled);
    const queue = await startQueue(inject('databaseUrl'), logger);
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    const started: string[] = [];
    try {
      const [succeeding, failing] = [`db-stop-ok-${randomUUID()}`, `db-stop-fail-${randomUUID()}`];
      for (const name of [succeeding, failing]) {
        await queue.boss.createQueue(name);
        await queue.boss.work(name, { pollingIntervalSeconds: 0.5 }, async () => {
          started.push(name);
          await released;
          if (name === failing) throw new Error('the job failed');
        });
        await queue.boss.send(name, {});
      }
      await waitFor(
        async () => started,
        (names) => names.length === 2,
        10_000,
        'both jobs to start',
      );

      restartCluster().stop();
      // Completing one job and failing the other both need the database that is gone now.
      release();

      const settlementErrors = (stackName: string) => lines.filter((line) => line.msg === 'job queue error' && line.err?.stack?.includes(stackName));
      await waitFor(
        async () => [settlementErrors('complete'), settlementErrors('fail')],
        (found) => found.every((errors) => errors.length > 0),
        10_000,
        'the failed completion and the failed failure to be reported',
      );
      expect(unhandled).toEqual([]);
    } finally {
      restartCluster();
      process.off('unhandledRejection', onUnhandled);
      await queue.stop();
    }
  });
});
