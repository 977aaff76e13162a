import { localDateOf } from '@shared/domain/shop-time';
import type { ShopSettings } from '@shared/schemas/settings';

/**
 * Today in the shop's time zone; before the settings arrive (or if they cannot), the browser's
 * own day, which is the shop's for a team working at the shop.
 */
export function shopToday(settings: Pick<ShopSettings, 'timeZone'> | undefined, now: Date = new Date()): string {
  return localDateOf(now, settings?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone);
}
