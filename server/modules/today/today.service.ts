import { isOpenRoastDay, SEARCH_HORIZON_DAYS } from '@shared/domain/roast-schedule';
import { addDays, localDateOf, type IsoDate } from '@shared/domain/shop-time';
import type { TodayResponse } from '@shared/schemas/today';
import type { Clock } from '../../lib/clock';
import type { PlanningService } from '../planning';
import type { RoastListService } from '../roastery';
import type { TodayRepo } from './today.repo';

/** An order still awaiting payment after a day has stalled (a checkout normally completes in minutes). */
export const awaitingPaymentHours = 24;
const failedMessagesShown = 5;

export interface TodayServiceDeps {
  repo: TodayRepo;
  clock: Clock;
  planning: PlanningService;
  roastList: RoastListService;
}

/** Today in the Roastery: the next roast day's work, parcels due out, what is stuck, and lots to reorder. */
export function createTodayService({ repo, clock, planning, roastList }: TodayServiceDeps) {
  async function nextRoastDate(today: IsoDate): Promise<IsoDate | null> {
    const settings = await repo.shopSettings();
    const calendar = { overrides: await repo.calendarOverrides(today) };
    for (let offset = 0; offset <= SEARCH_HORIZON_DAYS; offset += 1) {
      const date = addDays(today, offset);
      if (isOpenRoastDay(date, settings, calendar)) return date;
    }
    return null;
  }

  async function nextRoastDay(today: IsoDate): Promise<TodayResponse['nextRoastDay']> {
    const date = await nextRoastDate(today);
    if (date === null) return null;
    const { list } = await roastList.roastList(date);
    return {
      date,
      isToday: date === today,
      bags: list.lines.reduce((sum, line) => sum + line.bags, 0),
      roastedGrams: list.totals.toRoast.roastedGrams,
      greenGrams: list.totals.toRoast.greenGrams,
      batches: list.totals.toRoast.batches,
      shortfalls: list.pull.filter((pull) => pull.shortfallGrams > 0),
      warnings: list.warnings.length,
    };
  }

  return {
    async today(): Promise<TodayResponse> {
      const now = clock.now();
      const { timeZone } = await repo.shopSettings();
      const today = localDateOf(now, timeZone);
      const [roastDay, parcels, stuck, failedMessages, plan] = await Promise.all([
        nextRoastDay(today),
        repo.parcelsDue(today),
        repo.stuckOrders(new Date(now.getTime() - awaitingPaymentHours * 3_600_000)),
        repo.failedMessages(failedMessagesShown),
        planning.plan(8),
      ]);
      return {
        today,
        nextRoastDay: roastDay,
        parcels,
        stuck: { ...stuck, awaitingPaymentHours },
        failedMessages,
        reorder: plan.lots
          .filter((lot) => lot.reorderAlert)
          .map(({ lotCode, name, stockGrams, reorderPointGrams, runOutDate, reorderBy, reorderNow }) => ({
            lotCode,
            name,
            stockGrams,
            reorderPointGrams,
            runOutDate,
            reorderBy,
            reorderNow,
          })),
      };
    },
  };
}

export type TodayService = ReturnType<typeof createTodayService>;
