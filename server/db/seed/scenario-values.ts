// Values every part of the demo scenario uses: the row type of each table, the shop's invented
// prices and the seed's clock.
import type { PgTable } from 'drizzle-orm/pg-core';
import type { BagSize, RoastedBagSize } from '../../../shared/domain/vocabulary';

export type Insert<T extends PgTable> = T['$inferInsert'];

/** Fill weight of each bag size: the declared quantity rounded up to a whole gram (so a bag never weighs short). */
export const FILL_GRAMS: Record<BagSize, number> = { '8oz': 227, '12oz': 341, '1lb': 454, '2lb': 908, '5lb': 2268 };
/** Invented subscription prices per bag (cents), shipping included. */
export const SUBSCRIPTION_BAG_PRICE_CENTS: Record<RoastedBagSize, number> = { '12oz': 1800, '1lb': 2300, '2lb': 4300 };
/** Invented flat shipping for green orders under the free-shipping line. */
export const GREEN_SHIPPING_CENTS = 850;
export const FREE_SHIPPING_FROM_CENTS = 7500;
/** Orders and subscriptions take the columns' default currency; the e-mails name it. */
export const CURRENCY = 'usd';

export const DAY_MS = 86_400_000;
export const HOUR_MS = 3_600_000;

export type SeedClock = {
  now: Date;
  /** `days` days and `minutes` minutes before `now` (rounded down to the hour, for tidy demo times). */
  daysAgo(days: number, minutes?: number): Date;
};

export function seedClock(now: Date): SeedClock {
  const hour = Math.floor(now.getTime() / HOUR_MS) * HOUR_MS;
  return { now, daysAgo: (days, minutes = 10) => new Date(hour - days * DAY_MS - minutes * 60_000) };
}

export const earlier = (a: Date, b: Date) => (a.getTime() <= b.getTime() ? a : b);

/** Shop-local calendar date of an instant. */
export function localDate(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}
