import type { Db } from '../../db/client';
import type { FileStorage } from '../../integrations/storage';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createLotsRepo } from './lots.repo';
import { lotsRoutes } from './lots.routes';
import type { LotListCache } from './lot-list-cache';
import { createLotsService, type LotsService } from './lots.service';
import { createLotsAdminRepo } from './lots-admin.repo';
import { greenStockRoutes, lotsAdminRoutes } from './lots-admin.routes';
import { createLotsAdminService, type ReorderDates } from './lots-admin.service';

/** Lots: the shop's public catalogue, the staff's lot editing, and Green Stock in the Roastery. */
export function createLotsModule({
  db,
  storage,
  clock,
  listCache,
  reorderDates,
}: {
  db: Db;
  storage: FileStorage;
  clock: Clock;
  listCache?: LotListCache | undefined;
  /** Green planning's reorder-by day per lot, for Green Stock's reorder alerts. */
  reorderDates?: ReorderDates;
}): ApiModule & { catalogue: LotsService } {
  const admin = createLotsAdminService(createLotsAdminRepo(db), storage, clock, reorderDates);
  const catalogue = createLotsService(createLotsRepo(db), listCache);
  return {
    catalogue,
    mounts: [
      { path: '/lots', router: lotsRoutes(catalogue) },
      { path: '/lots', router: lotsAdminRoutes(admin) },
      { path: '/roastery/green-stock', router: greenStockRoutes(admin) },
    ],
  };
}

export { startLotListCache, type LotListCache } from './lot-list-cache';
export type { LotsService } from './lots.service';
