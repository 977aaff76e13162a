import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import { createShippingRepo } from './shipping.repo';
import { shippingRoutes } from './shipping.routes';

export { assertBagsShip } from './shipping.service';

/** The shipping part of the shop's settings, as `GET /api/shipping` publishes it. */
export const publishedShippingRules = (db: Db) => createShippingRepo(db).rules();

export function createShippingModule({ db }: { db: Db }): ApiModule {
  return { mounts: [{ path: '/shipping', router: shippingRoutes(createShippingRepo(db)) }] };
}
