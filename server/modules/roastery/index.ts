import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import { createBatchesRepo } from './batches.repo';
import { createBatchesService } from './batches.service';
import { createCalendarRepo, lossHistory, plannedGroups } from './calendar.repo';
import { createCalendarService } from './calendar.service';
import { roasteryRoutes } from './roastery.routes';
import { createRoastListRepo } from './roast-list.repo';
import { createRoastListService, type RoastListService } from './roast-list.service';
import { createRoasterySettingsRepo } from './settings.repo';
import { createRoasterySettingsService } from './settings.service';

export type { RoastListService };

/** A day's Roast List as the Roastery plans it, for modules that summarise it (Today). */
export const createRoastListReader = (db: Db): RoastListService => createRoastListService(createRoastListRepo(db));

/** What green planning shares with the Roast Calendar: paid roasted demand by day, and each lot's measured loss. */
export const roastedDemandBetween = plannedGroups;
export const measuredLossByLot = lossHistory;

/** The Roastery's settings, Roast Calendar, Roast List and batches. */
export function createRoasteryModule({ db }: { db: Db }): ApiModule {
  const router = roasteryRoutes({
    settings: createRoasterySettingsService(createRoasterySettingsRepo(db)),
    calendar: createCalendarService(createCalendarRepo(db)),
    roastList: createRoastListService(createRoastListRepo(db)),
    batches: createBatchesService(createBatchesRepo(db)),
  });
  return { mounts: [{ path: '/roastery', router }] };
}
