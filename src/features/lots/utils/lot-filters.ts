import { lotListQuerySchema, type LotListQuery } from '@shared/schemas/lots';

/** The Green Lots filters and sort, as kept in the page URL and sent to `GET /api/lots`. */
export type LotFilters = LotListQuery;

const lotFilterKeys = ['q', 'origin', 'process', 'level', 'inStock', 'minPricePerKgCents', 'maxPricePerKgCents', 'sort'] as const;
type LotFilterKey = (typeof lotFilterKeys)[number];

/**
 * Reads the filters from URL search params. A value the API would refuse (an unknown process, say,
 * or a minimum price above the maximum) is dropped rather than sent, so a hand-edited URL still
 * shows lots.
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
  if (filters.sort === 'origin') delete filters.sort;
  if (filters.minPricePerKgCents !== undefined && filters.maxPricePerKgCents !== undefined && filters.minPricePerKgCents > filters.maxPricePerKgCents) {
    delete filters.minPricePerKgCents;
    delete filters.maxPricePerKgCents;
  }
  return filters;
}

function assign<K extends LotFilterKey>(filters: LotFilters, key: K, value: NonNullable<LotFilters[K]>): void {
  filters[key] = value;
}

/** The inverse of `parseLotFilters`: only set filters appear, in a stable order; the default sort is left out. */
export function lotFiltersToSearchParams(filters: LotFilters): URLSearchParams {
  const search = new URLSearchParams();
  for (const key of lotFilterKeys) {
    const value = filters[key];
    if (value === undefined || value === '' || value === false) continue;
    if (key === 'sort' && value === 'origin') continue;
    search.set(key, String(value));
  }
  return search;
}

/** Whether anything narrows the list (the sort only orders it). */
export function hasActiveFilters(filters: LotFilters): boolean {
  const { sort: _sort, ...narrowing } = filters;
  return lotFiltersToSearchParams(narrowing).size > 0;
}
