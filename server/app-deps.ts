import type { Config } from './config';
import type { Database } from './db/client';
import type { Queue } from './jobs/queue';
import type { Clock } from './lib/clock';
import type { Logger } from './lib/logger';
import type { LotListCache } from './modules/lots';

/** What createApp is built from; index.ts and the tests supply it. */
export interface AppDeps {
  config: Config;
  database: Database;
  logger: Logger;
  /** With RESTDAY_TEST_CLOCK on, an AdjustableClock (createAdjustableClock) that POST /api/dev/clock moves. */
  clock: Clock;
  /** Absent in API-only test apps; health then reports the queue as stopped. */
  queue?: Queue;
  /** The lot list kept in memory by a server process; API-only test apps read the database each time. */
  lotListCache?: LotListCache;
}
