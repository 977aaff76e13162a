import { describe, expect, it } from 'vitest';
import type { RoastListSettings } from '@shared/domain/roast-list';
import type { ScheduleSettings } from '@shared/domain/roast-schedule';
import { defaultShopSettings, shopSettingsSchema, type ShopSettings } from '@shared/schemas/settings';
import type { Tx } from '../../server/db/client';
import { loadShopSettings, saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';

class Rollback extends Error {}

/** Runs against the shared test database inside a transaction that is always rolled back. */
async function rolledBack(work: (tx: Tx) => Promise<void>) {
  await getTestDb()
    .transaction(async (tx) => {
      await work(tx);
      throw new Rollback();
    })
    .catch((error: unknown) => {
      if (!(error instanceof Rollback)) throw error;
    });
}

describe('shop settings in the database', () => {
  it('reads back exactly what was saved, weekdays included, through the ISO-number columns', async () => {
    const changed: ShopSettings = shopSettingsSchema.parse({
      ...defaultShopSettings,
      timeZone: 'America/Denver',
      roastWeekdays: ['tue', 'sun'],
      shipWeekdays: ['mon', 'sat'],
      cutoff: { time: '09:30', daysBefore: 2 },
      restAdjustDays: { ...defaultShopSettings.restAdjustDays, dark: -2 },
      shipPolicy: 'after_degassing',
      holdOverWeekend: false,
      roastedBagPriceCents: { '12oz': 1_950, '1lb': 2_450, '2lb': 4_600 },
      subscriptionDiscountPct: 12.5,
      renewalReminderDays: 5,
      overagePct: 2.25,
    });
    await rolledBack(async (tx) => {
      await saveShopSettings(tx, changed, 'Test Roastery');
      const loaded = await loadShopSettings(tx);
      expect(loaded).toEqual({ shopName: 'Test Roastery', settings: changed });
    });
  });

  it('serves the trade engine directly: the loaded settings are schedule and roast-list settings', async () => {
    await rolledBack(async (tx) => {
      await saveShopSettings(tx, defaultShopSettings, 'Test Roastery');
      const { settings } = await loadShopSettings(tx);
      const forSchedule: ScheduleSettings = settings;
      const forRoastList: RoastListSettings = settings;
      expect(forSchedule.roastWeekdays).toEqual(['mon', 'wed', 'fri']);
      expect(forRoastList.roaster).toEqual({ capacityGrams: 12_000, minLoadPct: 50, maxLoadPct: 80 });
    });
  });
});
