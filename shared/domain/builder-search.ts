import type { BrewMethod, Grind, RoastedBagSize, RoastLevel } from './vocabulary';

/** The Roasted to Order builder's choices as a page address carries them, so sign-in, a shared link and a cancelled payment keep them. */
export const builderSearchKeys = {
  lotCode: 'lot',
  roastLevel: 'level',
  bagSize: 'size',
  bagsPerDelivery: 'bags',
  grind: 'grind',
  brewMethod: 'brew',
  cadenceWeeks: 'every',
} as const;

/** The search value that stands for the Roaster's Rotation (it has no lot code). */
export const rotationSearchValue = 'rotation';

export type BuilderSearchFields = {
  lotCode: string | null;
  roastLevel: RoastLevel;
  bagSize: RoastedBagSize;
  bagsPerDelivery: number;
  grind: Grind;
  brewMethod: BrewMethod;
  cadenceWeeks: number;
};

/** The choices as search params, in a stable order; a missing or half-typed one is left out. */
export function searchFromBuilder(fields: Partial<BuilderSearchFields>): URLSearchParams {
  const keys = builderSearchKeys;
  const search = new URLSearchParams();
  search.set(keys.lotCode, fields.lotCode ?? rotationSearchValue);
  if (fields.roastLevel) search.set(keys.roastLevel, fields.roastLevel);
  if (fields.bagSize) search.set(keys.bagSize, fields.bagSize);
  if (typeof fields.bagsPerDelivery === 'number' && Number.isFinite(fields.bagsPerDelivery)) {
    search.set(keys.bagsPerDelivery, String(fields.bagsPerDelivery));
  }
  if (fields.grind) search.set(keys.grind, fields.grind);
  if (fields.brewMethod) search.set(keys.brewMethod, fields.brewMethod);
  if (fields.cadenceWeeks !== undefined) search.set(keys.cadenceWeeks, String(fields.cadenceWeeks));
  return search;
}
