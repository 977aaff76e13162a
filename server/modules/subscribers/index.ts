import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createSubscribersRepo } from './subscribers.repo';
import { subscribersCsvRoutes, subscribersRoutes } from './subscribers.routes';
import { createSubscribersService } from './subscribers.service';

export function createSubscribersModule({ db, clock }: { db: Db; clock: Clock }): ApiModule {
  const service = createSubscribersService({ repo: createSubscribersRepo(db), clock });
  return {
    mounts: [
      { path: '/roastery/subscribers', router: subscribersRoutes(service) },
      { path: '/roastery/subscribers.csv', router: subscribersCsvRoutes(service) },
    ],
  };
}
