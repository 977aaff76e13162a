import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createAddressBook } from '../account';
import type { PaymentsService } from '../payments';
import { createCheckoutRepo } from './checkout.repo';
import { checkoutRoutes, unpaidOrderRoutes } from './checkout.routes';
import { createCheckoutService } from './checkout.service';

// For the payments module: an expired Stripe checkout gives its held stock back.
export { cancelUnpaidOrder } from './checkout.repo';

export function createCheckoutModule({ db, payments, clock }: { db: Db; payments: PaymentsService; clock: Clock }): ApiModule {
  const service = createCheckoutService({ repo: createCheckoutRepo(db), payments, clock, addressBook: createAddressBook(db) });
  return {
    mounts: [
      { path: '/checkout', router: checkoutRoutes(service) },
      { path: '/orders', router: unpaidOrderRoutes(service) },
    ],
  };
}
