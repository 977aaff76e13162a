import { eq, gte } from 'drizzle-orm';
import type { CalendarOverride } from '@shared/domain/roast-schedule';
import type { IsoDate } from '@shared/domain/shop-time';
import { weekdays, type Weekday } from '@shared/domain/vocabulary';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import type { DbOrTx } from '../../db/client';
import { roastDays, shopSettings } from '../../db/schema/index';

type SettingsRow = typeof shopSettings.$inferSelect;

/** The database keeps weekdays as ISO numbers (1 = Monday … 7 = Sunday); the API uses names. */
const weekdayFromIso = (day: number): Weekday => {
  const weekday = weekdays[day - 1];
  if (!weekday) throw new Error(`shop_settings holds the weekday ${day}, outside 1–7`);
  return weekday;
};
const isoFromWeekday = (weekday: Weekday) => weekdays.indexOf(weekday) + 1;

export interface ShopSettingsRecord {
  shopName: string;
  settings: ShopSettings;
}

function toSettings(row: SettingsRow): ShopSettings {
  return {
    timeZone: row.timeZone,
    currency: row.currency as ShopSettings['currency'],
    roastWeekdays: row.roastWeekdays.map(weekdayFromIso),
    cutoff: { time: row.cutoffTime, daysBefore: row.cutoffDaysBefore },
    shipWeekdays: row.shipWeekdays.map(weekdayFromIso),
    transitDays: row.transitDays,
    degasHoldDays: row.degasHoldDays,
    shipPolicy: row.shipPolicy,
    holdOverWeekend: row.holdOverWeekend,
    restDays: { filter: row.restDaysFilter, espresso: row.restDaysEspresso },
    restAdjustDays: row.restAdjustDays,
    bestBeforeDays: row.bestBeforeDays,
    overagePct: row.overagePct,
    dayCapacityGrams: row.dailyCapacityGrams,
    roaster: { capacityGrams: row.roasterCapacityGrams, minLoadPct: row.minLoadPct, maxLoadPct: row.maxLoadPct },
    lossModel: row.lossModel,
    lossModelMinBatches: row.lossModelMinBatches,
    roastedBagPriceCents: row.roastedBagPriceCents,
    subscriptionDiscountPct: row.subscriptionDiscountPct,
    renewalReminderDays: row.renewalReminderDays,
    shipping: row.shipping,
    placeOfBusiness: row.placeOfBusiness ?? null,
    carriers: row.carriers,
  };
}

function toColumns(settings: ShopSettings) {
  return {
    timeZone: settings.timeZone,
    currency: settings.currency,
    roastWeekdays: settings.roastWeekdays.map(isoFromWeekday),
    cutoffTime: settings.cutoff.time,
    cutoffDaysBefore: settings.cutoff.daysBefore,
    shipWeekdays: settings.shipWeekdays.map(isoFromWeekday),
    transitDays: settings.transitDays,
    degasHoldDays: settings.degasHoldDays,
    shipPolicy: settings.shipPolicy,
    holdOverWeekend: settings.holdOverWeekend,
    restDaysFilter: settings.restDays.filter,
    restDaysEspresso: settings.restDays.espresso,
    restAdjustDays: settings.restAdjustDays,
    bestBeforeDays: settings.bestBeforeDays,
    overagePct: settings.overagePct,
    dailyCapacityGrams: settings.dayCapacityGrams,
    roasterCapacityGrams: settings.roaster.capacityGrams,
    minLoadPct: settings.roaster.minLoadPct,
    maxLoadPct: settings.roaster.maxLoadPct,
    lossModel: settings.lossModel,
    lossModelMinBatches: settings.lossModelMinBatches,
    roastedBagPriceCents: settings.roastedBagPriceCents,
    subscriptionDiscountPct: settings.subscriptionDiscountPct,
    renewalReminderDays: settings.renewalReminderDays,
    shipping: settings.shipping,
    placeOfBusiness: settings.placeOfBusiness,
    carriers: settings.carriers,
  };
}

/**
 * The shop's one settings row, read as the API's `ShopSettings` (which also satisfies the trade
 * engine's ScheduleSettings, RoastListSettings and pricing settings). A database without the row
 * (a fresh install before the seed) reads as the product defaults.
 */
export async function loadShopSettings(db: DbOrTx): Promise<ShopSettingsRecord> {
  const [row] = await db.select().from(shopSettings).where(eq(shopSettings.id, 1));
  if (!row) return { shopName: 'Restday', settings: defaultShopSettings };
  return { shopName: row.shopName, settings: toSettings(row) };
}

/** Saves every setting in one statement; the row is created if missing. */
export async function saveShopSettings(db: DbOrTx, settings: ShopSettings, shopName?: string): Promise<ShopSettingsRecord> {
  const columns = toColumns(settings);
  const [row] = await db
    .insert(shopSettings)
    .values({ id: 1, shopName: shopName ?? 'Restday', ...columns })
    .onConflictDoUpdate({ target: shopSettings.id, set: { ...columns, ...(shopName ? { shopName } : {}) } })
    .returning();
  if (!row) throw new Error('saving the shop settings returned no row');
  return { shopName: row.shopName, settings: toSettings(row) };
}

/** Roast Calendar overrides (closures, other capacities) from a date on, keyed by date. */
export async function loadCalendarOverrides(db: DbOrTx, from: IsoDate): Promise<Record<IsoDate, CalendarOverride>> {
  const rows = await db
    .select({ date: roastDays.date, open: roastDays.open, shipOpen: roastDays.shipOpen, capacityGrams: roastDays.capacityGrams, note: roastDays.note })
    .from(roastDays)
    .where(gte(roastDays.date, from));
  return Object.fromEntries(rows.map(({ date, ...override }) => [date, override]));
}
