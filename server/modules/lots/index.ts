import type { Db } from '../../db/client';
import type { FileStorage } from '../../integrations/storage';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createLotsRepo } from './lots.repo';
import { lotsRoutes } from './lots.routes';
import { createLotsService } from './lots.service';
import { createLotsAdminRepo } from './lots-admin.repo';
import { greenStockRoutes, lotsAdminRoutes } from './lots-admin.routes';
import { createLotsAdminService } from './lots-admin.service';

/** Lots: the shop's public catalogue, the staff's lot editing, and Green Stock in the Roastery. */
export function createLotsModule({ db, storage, clock }: { db: Db; storage: FileStorage; clock: Clock }): ApiModule {
  const admin = createLotsAdminService(createLotsAdminRepo(db), storage, clock);
  return {
    mounts: [
      { path: '/lots', router: lotsRoutes(createLotsService(createLotsRepo(db))) },
      { path: '/lots', router: lotsAdminRoutes(admin) },
      { path: '/roastery/green-stock', router: greenStockRoutes(admin) },
    ],
  };
}
