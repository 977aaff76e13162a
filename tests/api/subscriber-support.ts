// Helpers for the Roasted to Order staff-side tests (preview, Subscribers, Roaster's Rotation,
// renewal reminders): the shop's settings and Roast Calendar overrides, pinned for a test file and
// put back after it.
import { inArray } from 'drizzle-orm';
import { afterAll, beforeAll } from 'vitest';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import { roastDays, shopSettings } from '../../server/db/schema/index';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';

/** Saves `settings` before the file's tests and restores the shop's row (or its absence) after them. */
export function useShopSettings(settings: ShopSettings = defaultShopSettings) {
  let saved: (typeof shopSettings.$inferSelect)[] = [];
  beforeAll(async () => {
    saved = await getTestDb().select().from(shopSettings);
    await saveShopSettings(getTestDb(), settings, 'Invented Test Roastery');
  });
  afterAll(async () => {
    await getTestDb().delete(shopSettings);
    if (saved.length > 0) await getTestDb().insert(shopSettings).values(saved);
  });
}

/** Roast Calendar overrides for a test, removed after the file. */
export function useCalendarOverrides() {
  const dates: string[] = [];
  afterAll(async () => {
    if (dates.length > 0) await getTestDb().delete(roastDays).where(inArray(roastDays.date, dates));
  });
  return async (date: string, override: { open: boolean; capacityGrams?: number | null; note?: string }) => {
    dates.push(date);
    await getTestDb()
      .insert(roastDays)
      .values({ date, open: override.open, capacityGrams: override.capacityGrams ?? null, note: override.note ?? '' })
      .onConflictDoUpdate({ target: roastDays.date, set: { open: override.open, capacityGrams: override.capacityGrams ?? null } });
  };
}
