import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createAddressBook } from '../account';
import type { AuditTrail } from '../audit';
import type { PaymentsService } from '../payments';
import { createSubscriptionsRepo } from './subscriptions.repo';
import { subscriptionCheckoutRoutes, subscriptionsRoutes } from './subscriptions.routes';
import { createSubscriptionsService, type SubscriptionsServiceDeps } from './subscriptions.service';

// For the subscribers and rotation modules: how a subscription and its kept deliveries read.
export { choiceOf, keptDeliveryColumns, keptDeliveryOf } from './subscription-records.repo';
// For the payments module: what a subscription's charges do to its deliveries.
export { holdUnpaidCycle, recordPaidCycle } from './subscription-billing';

export interface SubscriptionsModuleDeps {
  db: Db;
  payments: PaymentsService;
  clock: Clock;
  audit: AuditTrail;
  onChanged?: SubscriptionsServiceDeps['onChanged'];
}

/** Roasted to Order: its checkout, and each subscriber's own subscriptions and deliveries. */
export function createSubscriptionsModule({ db, payments, clock, audit, onChanged }: SubscriptionsModuleDeps): ApiModule {
  const service = createSubscriptionsService({ repo: createSubscriptionsRepo(db), payments, clock, onChanged, addressBook: createAddressBook(db), audit });
  return {
    mounts: [
      { path: '/checkout/subscription', router: subscriptionCheckoutRoutes(service) },
      { path: '/subscriptions', router: subscriptionsRoutes(service) },
    ],
  };
}
