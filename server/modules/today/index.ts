import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import type { PlanningService } from '../planning';
import { createRoastListReader } from '../roastery';
import { createTodayRepo } from './today.repo';
import { todayRoutes } from './today.routes';
import { createTodayService } from './today.service';

/** Today: the Roastery overview's figures (`GET /api/roastery/today`). */
export function createTodayModule({ db, clock, planning }: { db: Db; clock: Clock; planning: PlanningService }): ApiModule {
  const service = createTodayService({ repo: createTodayRepo(db), clock, planning, roastList: createRoastListReader(db) });
  return { mounts: [{ path: '/roastery', router: todayRoutes(service) }] };
}
