import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createPackingRepo } from './packing.repo';
import { packDayRoutes, packOrderRoutes } from './packing.routes';
import { createPackingService } from './packing.service';

/** The Pack List and labels of a roast day, and packing and shipping each order. */
export function createPackingModule({ db, clock }: { db: Db; clock: Clock }): ApiModule {
  const packing = createPackingService({ repo: createPackingRepo(db), clock });
  return {
    mounts: [
      { path: '/roastery/days', router: packDayRoutes(packing) },
      { path: '/orders', router: packOrderRoutes(packing) },
    ],
  };
}
