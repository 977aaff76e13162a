import { lotListQuerySchema, type LotListQuery } from '@shared/schemas/lots';

/** The Green Lots filters, as kept in the page URL and sent to `GET /api/lots`. */
export type LotFilters = LotListQuery;

const lotFilterKeys = ['q', 'origin', 'process', 'level', 'inStock'] as const;
type LotFilterKey = (typeof lotFilterKeys)[number];

/**
 * Reads the filters from URL search params. A value the API would refuse (an unknown process, say)
 * is dropped rather than sent, so a hand-edited URL still shows lots.
 */
export function parseLotFilters(search: URLSearchParams): LotFilters {
  const filters: LotFilters = {};
  const shape = lotListQuerySchema.shape;
  for (const key of lotFilterKeys) {
    const raw = search.get(key);
    if (raw === null || raw.trim() === '') continue;
    const parsed = shape[key].safeParse(raw);
    if (parsed.success && parsed.data !== undefined) assign(filters, key, parsed.data);
  }
  if (filters.inStock === false) delete filters.inStock;
  return filters;
}

function assign<K extends LotFilterKey>(filters: LotFilters, key: K, value: NonNullable<LotFilters[K]>): void {
  filters[key] = value;
}

/** The inverse of `parseLotFilters`: only set filters appear, in a stable order. */
export function lotFiltersToSearchParams(filters: LotFilters): URLSearchParams {
  const search = new URLSearchParams();
  for (const key of lotFilterKeys) {
    const value = filters[key];
    if (value === undefined || value === '' || value === false) continue;
    search.set(key, String(value));
  }
  return search;
}

export function hasActiveFilters(filters: LotFilters): boolean {
  return lotFiltersToSearchParams(filters).size > 0;
}
