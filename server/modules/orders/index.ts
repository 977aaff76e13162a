import type { Db } from '../../db/client';
import type { PaymentsGateway } from '../../integrations/payments';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import type { AuditTrail } from '../audit';
import { createOrderDeskRepo } from './order-desk.repo';
import { createOrderDeskService } from './order-desk.service';
import { createOrdersRepo } from './orders.repo';
import { ordersCsvRoutes, ordersRoutes } from './orders.routes';
import { createOrdersService } from './orders.service';
import { createRefundsRepo } from './refunds.repo';
import { createRefundsService } from './refunds.service';

/** Orders as customers and staff read them, their CSV export, the owner's refunds and staff's actions on an order. */
export function createOrdersModule({ db, gateway, clock, audit }: { db: Db; gateway: PaymentsGateway; clock: Clock; audit: AuditTrail }): ApiModule {
  const orders = createOrdersService(createOrdersRepo(db));
  const refunds = createRefundsService({ repo: createRefundsRepo(db), gateway });
  const desk = createOrderDeskService({ repo: createOrderDeskRepo(db), clock, audit });
  return {
    mounts: [
      { path: '/orders', router: ordersRoutes(orders, refunds, desk) },
      { path: '/orders.csv', router: ordersCsvRoutes(orders) },
    ],
  };
}
