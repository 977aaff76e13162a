import { earliestNominalDateStillAhead, planGreen, subscriptionRoastDemand, type SubscriptionForPlanning } from '@shared/domain/green-planning';
import { lotLossHistoryOf } from '@shared/domain/roast-list';
import { addDays, localDateOf } from '@shared/domain/shop-time';
import { coverWindowDays, isAtReorderPoint } from '@shared/domain/stock-cover';
import type { PlanningResponse } from '@shared/schemas/planning';
import type { Clock } from '../../lib/clock';
import { choiceOf, keptDeliveryOf } from '../subscriptions';
import type { PlanningRepo } from './planning.repo';

const dayMs = 86_400_000;

/**
 * Green planning: what every lot needs over the coming weeks from paid orders still to roast, the
 * subscriptions' upcoming deliveries and the recent pace of green sales, against its stock.
 */
export function createPlanningService({ repo, clock }: { repo: PlanningRepo; clock: Clock }) {
  return {
    async plan(weeks: number): Promise<PlanningResponse> {
      const now = clock.now();
      const settings = await repo.shopSettings();
      const today = localDateOf(now, settings.timeZone);
      const until = addDays(today, weeks * 7 - 1);
      const [overrides, lots, paidDemand, subscriptionRows, picks, lossRows] = await Promise.all([
        repo.calendarOverrides(today),
        repo.lots(new Date(now.getTime() - coverWindowDays * dayMs)),
        repo.paidDemand(today, until),
        repo.subscriptions(),
        repo.rotationPicks(today, until),
        repo.lossHistory(),
      ]);
      const keptRows = await repo.keptDeliveries(
        subscriptionRows.map((row) => row.id),
        today,
        earliestNominalDateStillAhead(today, settings, { overrides }),
      );
      const keptBySubscription = new Map<string, ReturnType<typeof keptDeliveryOf>[]>();
      for (const row of keptRows) {
        const kept = keptBySubscription.get(row.subscriptionId) ?? [];
        kept.push(keptDeliveryOf(row));
        keptBySubscription.set(row.subscriptionId, kept);
      }
      const subscriptions: SubscriptionForPlanning[] = subscriptionRows.map((row) => {
        const kept = keptBySubscription.get(row.id) ?? [];
        return {
          status: row.status,
          anchorDate: row.anchorDate ?? kept[0]?.nominalDate ?? null,
          cadenceWeeks: row.cadenceWeeks,
          pausedUntil: row.pausedUntil,
          cancelAtPeriodEnd: row.cancelAtPeriodEnd,
          choice: choiceOf(row),
          lotCode: row.lotCode,
          kept,
        };
      });
      const demand = [...paidDemand, ...subscriptionRoastDemand(subscriptions, settings, { overrides }, now, until, picks)];
      const plan = planGreen({ today, weeks, lots, demand, settings, lotLoss: lotLossHistoryOf(lossRows), runRateWindowDays: coverWindowDays });
      const lotByCode = new Map(lots.map((lot) => [lot.code, lot]));
      return {
        from: plan.from,
        weeks: plan.weeks,
        salesWindowDays: coverWindowDays,
        unpickedRotationGreenGrams: plan.unpickedRotationGreenGrams,
        lots: plan.lots.map((lotPlan) => {
          const lot = lotByCode.get(lotPlan.lotCode)!;
          return {
            ...lotPlan,
            name: lot.name,
            isListed: lot.isListed,
            reorderPointGrams: lot.reorderPointGrams,
            reorderAlert: lotPlan.reorderNow || isAtReorderPoint(lot.stockGrams, lot.reorderPointGrams),
          };
        }),
      };
    },
  };
}

export type PlanningService = ReturnType<typeof createPlanningService>;
