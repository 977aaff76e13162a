// `npm run worker`: queue workers without the HTTP server, for scaling out. Run as many as you like
// beside servers started with WORKERS_IN_SERVER=false (or beside ones that run their own): outbox
// rows and pg-boss jobs are claimed so that no two workers take the same one.
import type { Config } from './config';
import { createDatabase } from './db/client';
import { startQueue } from './jobs/queue';
import { startWorkers } from './jobs/workers';
import { createAdjustableClock, systemClock } from './lib/clock';
import { createLogger, type Logger } from './lib/logger';
import { isMainModule, runMain } from './lib/run-main';

export interface RunningWorker {
  stop(): Promise<void>;
}

export async function startWorkerProcess(config: Config, logger: Logger = createLogger(config)): Promise<RunningWorker> {
  const database = createDatabase({
    url: config.DATABASE_URL,
    poolMax: Math.min(config.DATABASE_POOL_MAX, 4),
    connectTimeoutMs: config.DATABASE_CONNECT_TIMEOUT_MS,
    onIdleError: (error) => logger.warn({ err: error }, 'database connection dropped'),
  });
  const queue = await startQueue(config.DATABASE_URL, logger);
  // With the test clock on, this process follows moves announced by any server's POST /api/dev/clock.
  const clock = config.RESTDAY_TEST_CLOCK ? createAdjustableClock() : systemClock;
  let workers;
  try {
    workers = await startWorkers({ config, database, queue, clock, logger });
  } catch (error) {
    await queue.stop();
    await database.close();
    throw error;
  }
  logger.info('Restday worker is running');
  return {
    async stop() {
      await workers.stop();
      await queue.stop();
      await database.close();
      logger.info('Restday worker stopped');
    },
  };
}

if (isMainModule(import.meta.url)) void runMain('Restday worker', startWorkerProcess);
