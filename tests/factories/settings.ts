// The shop's settings as a test wants them.
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';

/** The product defaults with the test's own changes, saved as the shop's settings. */
export async function saveTestShopSettings(changes: Partial<ShopSettings> = {}): Promise<ShopSettings> {
  const settings = { ...defaultShopSettings, ...changes };
  await saveShopSettings(getTestDb(), settings, 'Invented Test Roastery');
  return settings;
}
