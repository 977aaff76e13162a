import type { ShippingRules } from '@shared/schemas/shipping';
import type { DbOrTx } from '../../db/client';
import { loadShopSettings } from '../settings';

/** The shipping part of the owner's settings, read fresh each time (one row). */
export async function loadShippingRules(db: DbOrTx): Promise<ShippingRules> {
  const { settings } = await loadShopSettings(db);
  return { currency: settings.currency, ...settings.shipping };
}

export function createShippingRepo(db: DbOrTx) {
  return { rules: () => loadShippingRules(db) };
}

export type ShippingRepo = ReturnType<typeof createShippingRepo>;
