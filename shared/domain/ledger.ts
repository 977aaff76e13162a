/**
 * The Ledger's calendar and money rules.
 *
 * - `ledgerWeekStarts(today, weeks)`: the Mondays of the last `weeks` weeks, oldest first, ending
 *   with the week holding `today` (weeks run Monday to Sunday, ISO 8601, in the shop's time zone).
 * - `monthlyRecurringCents(priceCents, cadenceWeeks)`: one subscription's recurring revenue per
 *   month, a delivery's price × 52 weeks ÷ 12 months ÷ the cadence, rounded half up to a cent.
 * - `orderSalesKind(kind, subscriptionId)`: green, roasted one-off, or subscription.
 * - `subscriptionWeeks(subscriptions, weekStarts, timeZone)`: per week, the subscriptions on the
 *   books at its end (paused ones too), started, paused and cancelled in it, and the recurring
 *   revenue per month of those neither cancelled nor paused at its end.
 */
import { roundHalfUpDiv } from './integer-math';
import { addDays, instantAt, weekdayOf, type IsoDate } from './shop-time';
import { weekdays, type OrderKind } from './vocabulary';

export const salesKinds = ['green', 'roasted', 'subscription'] as const;
export type SalesKind = (typeof salesKinds)[number];

export function weekStartOf(date: IsoDate): IsoDate {
  return addDays(date, -weekdays.indexOf(weekdayOf(date)));
}

export function ledgerWeekStarts(today: IsoDate, weeks: number): IsoDate[] {
  if (!Number.isSafeInteger(weeks) || weeks < 1) throw new RangeError(`weeks must be a whole number ≥ 1, got ${weeks}`);
  const last = weekStartOf(today);
  return Array.from({ length: weeks }, (_, index) => addDays(last, (index - weeks + 1) * 7));
}

export function monthlyRecurringCents(priceCents: number, cadenceWeeks: number): number {
  if (!Number.isSafeInteger(priceCents) || priceCents < 0) throw new RangeError(`priceCents must be whole cents ≥ 0, got ${priceCents}`);
  if (!Number.isSafeInteger(cadenceWeeks) || cadenceWeeks < 1) throw new RangeError(`cadenceWeeks must be a whole number ≥ 1, got ${cadenceWeeks}`);
  return roundHalfUpDiv(priceCents * 52, 12 * cadenceWeeks);
}

export function orderSalesKind(kind: OrderKind, subscriptionId: string | null): SalesKind {
  if (kind === 'green') return 'green';
  return subscriptionId === null ? 'roasted' : 'subscription';
}

/** What the Ledger reads of one subscription. */
export interface SubscriptionHistory {
  createdAt: Date;
  cancelledAt: Date | null;
  /** The latest pause, and the shop-local day it runs until. */
  pausedAt: Date | null;
  pausedUntil: IsoDate | null;
  priceCents: number;
  cadenceWeeks: number;
}

export interface SubscriptionWeek {
  weekStart: IsoDate;
  active: number;
  started: number;
  paused: number;
  cancelled: number;
  monthlyRecurringCents: number;
}

export function subscriptionWeeks(subscriptions: readonly SubscriptionHistory[], weekStarts: readonly IsoDate[], timeZone: string): SubscriptionWeek[] {
  return weekStarts.map((weekStart) => {
    const starts = instantAt(weekStart, '00:00', timeZone).getTime();
    const ends = instantAt(addDays(weekStart, 7), '00:00', timeZone).getTime();
    const lastDay = addDays(weekStart, 6);
    const within = (at: Date | null) => at !== null && at.getTime() >= starts && at.getTime() < ends;
    const week: SubscriptionWeek = { weekStart, active: 0, started: 0, paused: 0, cancelled: 0, monthlyRecurringCents: 0 };
    for (const subscription of subscriptions) {
      if (within(subscription.createdAt)) week.started += 1;
      if (within(subscription.pausedAt)) week.paused += 1;
      if (within(subscription.cancelledAt)) week.cancelled += 1;
      const onBooks = subscription.createdAt.getTime() < ends && (subscription.cancelledAt === null || subscription.cancelledAt.getTime() >= ends);
      if (!onBooks) continue;
      week.active += 1;
      const pausedAtEnd =
        subscription.pausedAt !== null && subscription.pausedAt.getTime() < ends && subscription.pausedUntil !== null && subscription.pausedUntil > lastDay;
      if (!pausedAtEnd) week.monthlyRecurringCents += monthlyRecurringCents(subscription.priceCents, subscription.cadenceWeeks);
    }
    return week;
  });
}
