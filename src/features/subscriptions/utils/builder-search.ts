import type { z } from 'zod';
import { builderSearchKeys, rotationSearchValue, searchFromBuilder as searchFromSharedBuilder } from '@shared/domain/builder-search';
import { subscriptionBuilderSchema, type SubscriptionBuild } from './subscription-form';

/** The builder's choices as the URL carries them, so sign-in and a shared link keep them. */
export type BuilderFields = z.input<typeof subscriptionBuilderSchema>;

export { rotationSearchValue } from '@shared/domain/builder-search';

const keys = builderSearchKeys satisfies Record<keyof BuilderFields, string>;

export const builderDefaults: SubscriptionBuild = {
  lotCode: null,
  roastLevel: 'medium',
  bagSize: '12oz',
  bagsPerDelivery: 1,
  grind: 'whole-bean',
  brewMethod: 'filter',
  cadenceWeeks: 2,
};

/**
 * Reads the choices from the search; a value the rules refuse (a hand-edited `bags=99`, say) is
 * left at its default rather than failing the page.
 */
export function builderFromSearch(search: URLSearchParams): SubscriptionBuild {
  const shape = subscriptionBuilderSchema.shape;
  const lot = search.get(keys.lotCode)?.trim();
  const pick = <K extends Exclude<keyof SubscriptionBuild, 'lotCode'>>(key: K, raw: unknown): SubscriptionBuild[K] => {
    const parsed = shape[key].safeParse(raw);
    return parsed.success ? (parsed.data as SubscriptionBuild[K]) : builderDefaults[key];
  };
  const number = (key: string) => {
    const raw = search.get(key);
    return raw === null || raw === '' ? undefined : Number(raw);
  };
  return {
    lotCode: lot && lot !== rotationSearchValue ? lot : null,
    roastLevel: pick('roastLevel', search.get(keys.roastLevel) ?? undefined),
    bagSize: pick('bagSize', search.get(keys.bagSize) ?? undefined),
    bagsPerDelivery: pick('bagsPerDelivery', number(keys.bagsPerDelivery)),
    grind: pick('grind', search.get(keys.grind) ?? undefined),
    brewMethod: pick('brewMethod', search.get(keys.brewMethod) ?? undefined),
    cadenceWeeks: pick('cadenceWeeks', number(keys.cadenceWeeks)),
  };
}

/** Whether the search names a roast level itself (otherwise the lot's suggestion is taken). */
export function searchNamesLevel(search: URLSearchParams): boolean {
  return search.has(keys.roastLevel);
}

/** The inverse of `builderFromSearch`, in a stable order; a half-typed bag count is left out. */
export function searchFromBuilder(fields: Partial<BuilderFields>): URLSearchParams {
  return searchFromSharedBuilder({ ...fields, bagsPerDelivery: typeof fields.bagsPerDelivery === 'number' ? fields.bagsPerDelivery : undefined });
}

/** A complete, valid set of choices from the search, or null when something is missing or refused. */
export function completeBuildFromSearch(search: URLSearchParams): SubscriptionBuild | null {
  const lot = search.get(keys.lotCode)?.trim();
  const parsed = subscriptionBuilderSchema.safeParse({
    lotCode: lot && lot !== rotationSearchValue ? lot : lot === rotationSearchValue ? null : undefined,
    roastLevel: search.get(keys.roastLevel) ?? undefined,
    bagSize: search.get(keys.bagSize) ?? undefined,
    bagsPerDelivery: Number(search.get(keys.bagsPerDelivery) ?? Number.NaN),
    grind: search.get(keys.grind) ?? undefined,
    brewMethod: search.get(keys.brewMethod) ?? undefined,
    cadenceWeeks: Number(search.get(keys.cadenceWeeks) ?? Number.NaN),
  });
  return parsed.success ? parsed.data : null;
}
