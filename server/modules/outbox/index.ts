import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import { createOutboxRepo } from './outbox.repo';
import { outboxRoutes } from './outbox.routes';
import { createOutboxService } from './outbox.service';

export { queueEmail, type QueuedEmail } from './outbox.repo';

/** The e-mail outbox as staff read it; other modules queue e-mail with `queueEmail` in their own transaction. */
export function createOutboxModule({ db }: { db: Db }): ApiModule {
  return { mounts: [{ path: '/roastery/outbox', router: outboxRoutes(createOutboxService(createOutboxRepo(db))) }] };
}
