import type { Server } from 'node:http';
import { createApp } from './app';
import type { Config } from './config';
import { createDatabase } from './db/client';
import { startQueue } from './jobs/queue';
import { ensureJobQueues } from './jobs/registry';
import { jobs, startWorkers, type Workers } from './jobs/workers';
import { createAdjustableClock, systemClock } from './lib/clock';
import { createLogger, type Logger } from './lib/logger';
import { isMainModule, runMain } from './lib/run-main';
import { startLotListCache } from './modules/lots';

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

/** Opens the database and the queue, listens, and returns a handle that shuts all three down. */
export async function startServer(config: Config, logger: Logger = createLogger(config)): Promise<RunningServer> {
  const database = createDatabase({
    url: config.DATABASE_URL,
    poolMax: config.DATABASE_POOL_MAX,
    connectTimeoutMs: config.DATABASE_CONNECT_TIMEOUT_MS,
    onIdleError: (error) => logger.warn({ err: error }, 'database connection dropped'),
  });
  const queue = await startQueue(config.DATABASE_URL, logger);
  // Every process that queues jobs makes sure their queues exist, workers or not: pg-boss drops a job sent to a missing queue.
  await ensureJobQueues(queue.boss, jobs);
  const clock = config.RESTDAY_TEST_CLOCK ? createAdjustableClock() : systemClock;
  // The queue workers (outbox relay, jobs) run here unless WORKERS_IN_SERVER=false leaves them to `npm run worker`.
  let workers: Workers | undefined;
  try {
    if (config.WORKERS_IN_SERVER) workers = await startWorkers({ config, database, queue, clock, logger });
  } catch (error) {
    await queue.stop();
    await database.close();
    throw error;
  }
  const lotListCache = startLotListCache({ databaseUrl: config.DATABASE_URL, logger });
  const app = createApp({ config, database, logger, queue, clock, lotListCache });

  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(config.PORT, config.HOST, () => resolve(listening));
    listening.once('error', reject);
  });
  const url = `http://${config.HOST}:${config.PORT}`;
  logger.info({ url }, 'Restday is listening');

  return {
    url,
    async stop() {
      // Finish requests in flight, then let go of the queue and the pool.
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeIdleConnections();
      const forceAfter = setTimeout(() => server.closeAllConnections(), 5000).unref();
      await closed;
      clearTimeout(forceAfter);
      await workers?.stop();
      await lotListCache.stop();
      await queue.stop();
      await database.close();
      logger.info('Restday stopped');
    },
  };
}

if (isMainModule(import.meta.url)) void runMain('Restday', startServer);
