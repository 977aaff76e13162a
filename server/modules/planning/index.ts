import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createPlanningRepo } from './planning.repo';
import { planningRoutes } from './planning.routes';
import { createPlanningService, type PlanningService } from './planning.service';

export type { PlanningService };

/** Green planning for staff; Today and the Ledger read the same plan through `service`. */
export function createPlanningModule({ db, clock }: { db: Db; clock: Clock }): ApiModule & { service: PlanningService } {
  const service = createPlanningService({ repo: createPlanningRepo(db), clock });
  return { service, mounts: [{ path: '/roastery', router: planningRoutes(service) }] };
}
