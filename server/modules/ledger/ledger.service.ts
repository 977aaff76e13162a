import { ledgerWeekStarts, monthlyRecurringCents } from '@shared/domain/ledger';
import { assessBatchLoss } from '@shared/domain/roast-loss';
import { addDays, instantAt, localDateOf, type IsoDate } from '@shared/domain/shop-time';
import type { LedgerResponse, LedgerSubscriptionsWeek } from '@shared/schemas/ledger';
import type { Clock } from '../../lib/clock';
import type { LedgerRepo, LedgerSpan } from './ledger.repo';

type SubscriptionRow = Awaited<ReturnType<LedgerRepo['subscriptionsInSpan']>>[number];

/** Each week's subscription figures: on the books at its end, started, paused and cancelled in it, and recurring revenue at its end. */
function subscriptionWeeks(rows: readonly SubscriptionRow[], weekStarts: readonly IsoDate[], timeZone: string): LedgerSubscriptionsWeek[] {
  return weekStarts.map((weekStart) => {
    const starts = instantAt(weekStart, '00:00', timeZone).getTime();
    const ends = instantAt(addDays(weekStart, 7), '00:00', timeZone).getTime();
    const lastDay = addDays(weekStart, 6);
    const within = (at: Date | null) => at !== null && at.getTime() >= starts && at.getTime() < ends;
    const figures = { weekStart, active: 0, started: 0, paused: 0, cancelled: 0, monthlyRecurringCents: 0 };
    for (const row of rows) {
      if (within(row.createdAt)) figures.started += 1;
      if (within(row.pausedAt)) figures.paused += 1;
      if (within(row.cancelledAt)) figures.cancelled += 1;
      const onBooks = row.createdAt.getTime() < ends && (row.cancelledAt === null || row.cancelledAt.getTime() >= ends);
      if (!onBooks) continue;
      figures.active += 1;
      const pausedAtEnd = row.pausedAt !== null && row.pausedAt.getTime() < ends && row.pausedUntil !== null && row.pausedUntil > lastDay;
      if (!pausedAtEnd) figures.monthlyRecurringCents += monthlyRecurringCents(row.priceCents, row.cadenceWeeks);
    }
    return figures;
  });
}

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
