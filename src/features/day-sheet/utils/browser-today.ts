import { localDateOf } from '@shared/domain/shop-time';

/**
 * Today's date where the browser is. The team works at the shop, so this is the shop's day; the
 * Day Sheet shows the date it opened, and the switcher moves to any other.
 */
export function browserToday(now: Date = new Date()): string {
  return localDateOf(now, Intl.DateTimeFormat().resolvedOptions().timeZone);
}
