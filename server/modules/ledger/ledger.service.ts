import { ledgerWeekStarts, subscriptionWeeks } from '@shared/domain/ledger';
import { assessBatchLoss } from '@shared/domain/roast-loss';
import { addDays, instantAt, localDateOf } from '@shared/domain/shop-time';
import type { LedgerResponse } from '@shared/schemas/ledger';
import type { Clock } from '../../lib/clock';
import type { LedgerRepo, LedgerSpan } from './ledger.repo';

/** The owner's Ledger: the last weeks' sales, refunds, subscriptions, green coffee and roast loss. */
export function createLedgerService({ repo, clock }: { repo: LedgerRepo; clock: Clock }) {
  return {
    async ledger(weeks: number): Promise<LedgerResponse> {
      const settings = await repo.shopSettings();
      const { timeZone } = settings;
      const weekStarts = ledgerWeekStarts(localDateOf(clock.now(), timeZone), weeks);
      const from = weekStarts[0]!;
      const end = addDays(weekStarts.at(-1)!, 7);
      const span: LedgerSpan = { timeZone, from, end, fromInstant: instantAt(from, '00:00', timeZone), endInstant: instantAt(end, '00:00', timeZone) };
      const [paid, refunds, greenSold, roasted, lossRows, subscriptionRows] = await Promise.all([
        repo.paidByWeek(span),
        repo.refundsByWeek(span),
        repo.greenSoldByWeek(span),
        repo.roastedByWeek(span),
        repo.lossByLot(span),
        repo.subscriptionsInSpan(span),
      ]);
      const sales = weekStarts.map((weekStart) => {
        const week = { weekStart, greenCents: 0, roastedCents: 0, subscriptionCents: 0, totalCents: 0, refundsCents: refunds.get(weekStart) ?? 0, orders: 0 };
        for (const row of paid) {
          if (row.weekStart !== weekStart) continue;
          if (row.kind === 'green') week.greenCents += row.cents;
          else if (row.subscription) week.subscriptionCents += row.cents;
          else week.roastedCents += row.cents;
          week.totalCents += row.cents;
          week.orders += row.orders;
        }
        return week;
      });
      return {
        currency: settings.currency,
        timeZone,
        weeks,
        from,
        to: addDays(end, -1),
        sales,
        subscriptions: subscriptionWeeks(subscriptionRows, weekStarts, timeZone),
        green: weekStarts.map((weekStart) => ({ weekStart, roastedGreenGrams: roasted.get(weekStart) ?? 0, soldGreenGrams: greenSold.get(weekStart) ?? 0 })),
        loss: lossRows.map((row) => {
          const assessment = assessBatchLoss(row.roastLevel, row.greenGramsIn, row.roastedGramsOut, settings.lossModel);
          return { ...row, lossPct: assessment.lossPct, expected: settings.lossModel[row.roastLevel], position: assessment.position };
        }),
      };
    },
  };
}

export type LedgerService = ReturnType<typeof createLedgerService>;
