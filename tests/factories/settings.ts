// The shop's settings as a test wants them.
import { defaultLossModel } from '@shared/domain/roast-loss';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';

/** An invented place of business for the bag labels (the town and street exist nowhere). */
export const testPlaceOfBusiness = {
  line1: '14 Kettle Lane',
  line2: null,
  city: 'Greyhaven',
  region: 'WA',
  postalCode: '98201',
  country: 'US',
} satisfies NonNullable<ShopSettings['placeOfBusiness']>;

/** A full `PUT /api/roastery/settings` body: the product defaults and the invented place of business. */
export const testShopSettingsBody = { ...defaultShopSettings, placeOfBusiness: testPlaceOfBusiness } satisfies ShopSettings;

/** The product defaults with the test's own changes, saved as the shop's settings. */
export async function saveTestShopSettings(changes: Partial<ShopSettings> = {}): Promise<ShopSettings> {
  const settings = { ...defaultShopSettings, ...changes };
  await saveShopSettings(getTestDb(), settings, 'Invented Test Roastery');
  return settings;
}

/**
 * The figures the Roast List's hand-worked examples use, set rather than trusted to the defaults:
 * 2 % overage (a small configurable overage on the Roast List), a 12 kg roaster at a preferred
 * 50–80 % load (shop roasters hold about 12 kg, usually loaded at 50–80 % of rated capacity, from
 * memory), medium loss 15 % (medium roasts lose 14–16 %, midpoint 15, from memory).
 */
export const roastListTestSettings = {
  overagePct: 2,
  roaster: { capacityGrams: 12_000, minLoadPct: 50, maxLoadPct: 80 },
  lossModel: { ...defaultLossModel, medium: { minPct: 14, maxPct: 16, defaultPct: 15 } },
  lossModelMinBatches: 3,
  roastWeekdays: ['mon', 'wed', 'fri'],
  dayCapacityGrams: 60_000,
} satisfies Partial<ShopSettings>;
