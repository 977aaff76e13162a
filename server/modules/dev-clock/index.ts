import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { AdjustableClock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { createDevClockRepo } from './dev-clock.repo';
import { devClockRoutes } from './dev-clock.routes';
import { createDevClockService, type OnClockMoved } from './dev-clock.service';

export { CLOCK_CHANNEL, followClockBroadcasts, isAdjustableClock } from './dev-clock.service';

/** The test clock that e2e and reliability runs move (`POST /api/dev/clock`); never mounted in production. */
export function createDevClockModule({
  clock,
  db,
  logger,
  runDueJobs,
}: {
  clock: AdjustableClock;
  db: Db;
  logger: Logger;
  runDueJobs?: OnClockMoved;
}): ApiModule {
  return { mounts: [{ path: '/dev/clock', router: devClockRoutes(createDevClockService(clock, createDevClockRepo(db), logger, runDueJobs)) }] };
}
