import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import { createTraceRepo } from './trace.repo';
import { batchTraceRoutes, orderTraceRoutes } from './trace.routes';
import { createTraceService } from './trace.service';

/** Recall reads for staff: from an order back to its lots, and from a batch on to its orders. */
export function createTraceModule({ db }: { db: Db }): ApiModule {
  const service = createTraceService(createTraceRepo(db));
  return {
    mounts: [
      { path: '/orders', router: orderTraceRoutes(service) },
      { path: '/roastery/batches', router: batchTraceRoutes(service) },
    ],
  };
}
