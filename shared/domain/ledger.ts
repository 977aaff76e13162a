/**
 * The Ledger's calendar and money rules.
 *
 * - `ledgerWeekStarts(today, weeks)`: the Mondays of the last `weeks` weeks, oldest first, ending
 *   with the week holding `today` (weeks run Monday to Sunday, ISO 8601, in the shop's time zone).
 * - `monthlyRecurringCents(priceCents, cadenceWeeks)`: one subscription's recurring revenue per
 *   month, a delivery's price × 52 weeks ÷ 12 months ÷ the cadence, rounded half up to a cent.
 * - `orderSalesKind(kind, subscriptionId)`: green, roasted one-off, or subscription.
 */
import { roundHalfUpDiv } from './integer-math';
import { addDays, weekdayOf, type IsoDate } from './shop-time';
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
