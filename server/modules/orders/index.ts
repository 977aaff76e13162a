import type { Db } from '../../db/client';
import type { PaymentsGateway } from '../../integrations/payments';
import type { ApiModule } from '../../lib/api-module';
import { createOrdersRepo } from './orders.repo';
import { ordersCsvRoutes, ordersRoutes } from './orders.routes';
import { createOrdersService } from './orders.service';
import { createRefundsRepo } from './refunds.repo';
import { createRefundsService } from './refunds.service';

/** Orders as customers and staff read them, their CSV export, and the owner's refunds. */
export function createOrdersModule({ db, gateway }: { db: Db; gateway: PaymentsGateway }): ApiModule {
  const orders = createOrdersService(createOrdersRepo(db));
  const refunds = createRefundsService({ repo: createRefundsRepo(db), gateway });
  return {
    mounts: [
      { path: '/orders', router: ordersRoutes(orders, refunds) },
      { path: '/orders.csv', router: ordersCsvRoutes(orders) },
    ],
  };
}
