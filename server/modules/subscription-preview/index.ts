import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createSubscriptionPreviewRepo } from './subscription-preview.repo';
import { subscriptionPreviewRoutes } from './subscription-preview.routes';
import { createSubscriptionPreviewService } from './subscription-preview.service';

/** Mount before the subscriptions module, so `/subscriptions/preview` is never read as a subscription id. */
export function createSubscriptionPreviewModule({ db, clock }: { db: Db; clock: Clock }): ApiModule {
  const service = createSubscriptionPreviewService({ repo: createSubscriptionPreviewRepo(db), clock });
  return { mounts: [{ path: '/subscriptions/preview', router: subscriptionPreviewRoutes(service) }] };
}
