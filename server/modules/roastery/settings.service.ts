import { isDeepStrictEqual } from 'node:util';
import type { ShopSettings } from '@shared/schemas/settings';
import type { RoasterySettingsRepo } from './settings.repo';

export function createRoasterySettingsService(repo: RoasterySettingsRepo) {
  return {
    async get(): Promise<ShopSettings> {
      return (await repo.load()).settings;
    },

    /** Saves the whole settings object; the audit row names the settings that changed. */
    async replace(settings: ShopSettings, actor: { id: string; ip: string | null }): Promise<ShopSettings> {
      const { settings: before } = await repo.load();
      const changed = (Object.keys(settings) as (keyof ShopSettings)[]).filter((key) => !isDeepStrictEqual(settings[key], before[key]));
      return (await repo.save(settings, { actorId: actor.id, ip: actor.ip, changed })).settings;
    },
  };
}

export type RoasterySettingsService = ReturnType<typeof createRoasterySettingsService>;
