import type { ShopSettings } from '@shared/schemas/settings';
import type { Db } from '../../db/client';
import { auditLog } from '../../db/schema/index';
import { loadShopSettings, saveShopSettings, type ShopSettingsRecord } from '../settings';

export interface SettingsChange {
  actorId: string;
  ip: string | null;
  /** Top-level settings whose value changed. */
  changed: string[];
}

/** The owner's shop settings as the Roastery reads and writes them; every save is audited in its own transaction. */
export function createRoasterySettingsRepo(db: Db) {
  return {
    load: (): Promise<ShopSettingsRecord> => loadShopSettings(db),

    async save(settings: ShopSettings, change: SettingsChange): Promise<ShopSettingsRecord> {
      return db.transaction(async (tx) => {
        const saved = await saveShopSettings(tx, settings);
        await tx.insert(auditLog).values({
          action: 'settings.changed',
          actorId: change.actorId,
          ip: change.ip,
          detail: { changed: change.changed.join(',') },
        });
        return saved;
      });
    },
  };
}

export type RoasterySettingsRepo = ReturnType<typeof createRoasterySettingsRepo>;
