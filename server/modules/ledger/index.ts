import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createLedgerRepo } from './ledger.repo';
import { ledgerRoutes } from './ledger.routes';
import { createLedgerService } from './ledger.service';

/** The owner's Ledger: weekly sales, refunds, subscriptions, green coffee and roast loss. */
export function createLedgerModule({ db, clock }: { db: Db; clock: Clock }): ApiModule {
  return { mounts: [{ path: '/owner/ledger', router: ledgerRoutes(createLedgerService({ repo: createLedgerRepo(db), clock })) }] };
}
