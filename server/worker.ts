// `npm run worker`: queue workers without the HTTP server, for scaling out. Run as many as you like
// beside servers started with WORKERS_IN_SERVER=false (or beside ones that run their own): outbox
// rows and pg-boss jobs are claimed so that no two workers take the same one.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ConfigError, loadConfig, type Config } from './config';
import { createDatabase } from './db/client';
import { startQueue } from './jobs/queue';
import { startWorkers } from './jobs/workers';
import { createAdjustableClock, systemClock } from './lib/clock';
import { createLogger, type Logger } from './lib/logger';

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

async function main() {
  let config: Config;
  try {
    config = loadConfig();
  } catch (error) {
    if (error instanceof ConfigError) {
      console.error(error.message);
      process.exit(1);
    }
    throw error;
  }
  const logger = createLogger(config);
  const running = await startWorkerProcess(config, logger);
  let stopping = false;
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      if (stopping) return;
      stopping = true;
      running.stop().then(
        () => process.exit(0),
        (error: unknown) => {
          logger.error({ err: error }, 'shutdown failed');
          process.exit(1);
        },
      );
    });
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? `Restday worker could not start: ${error.message}` : error);
    process.exit(1);
  });
}
