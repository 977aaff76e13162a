import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import { createJournalRepo } from './journal.repo';
import { homeRoastsRoutes, journalCsvRoutes, journalRoutes, journalSummaryRoutes } from './journal.routes';
import { createJournalService } from './journal.service';

/** The Roast Journal: a customer's home roasts, and the anonymous per-lot figures the shop and the lot page read. */
export function createJournalModule({ db, clock }: { db: Db; clock: Clock }): ApiModule {
  const service = createJournalService(createJournalRepo(db), clock);
  return {
    mounts: [
      { path: '/journal', router: journalRoutes(service) },
      { path: '/journal.csv', router: journalCsvRoutes(service) },
      { path: '/roastery/lots', router: journalSummaryRoutes(service) },
      { path: '/lots', router: homeRoastsRoutes(service) },
    ],
  };
}
