import { orderListQuerySchema, type OrderSort } from '@shared/schemas/orders';
import type { OrderKind, OrderStatus } from '@shared/domain/vocabulary';

/** The staff orders table's filters, sort and page, as kept in the page URL. */
export type RoasteryOrderFilters = {
  /** Name, e-mail or order reference. */
  q?: string;
  status?: OrderStatus;
  kind?: OrderKind;
  /** Shop days the order was placed, both inclusive. */
  from?: string;
  to?: string;
  roastDate?: string;
  sort: OrderSort;
  page: number;
};

const filterKeys = ['q', 'status', 'kind', 'from', 'to', 'roastDate'] as const;
type FilterKey = (typeof filterKeys)[number];
const defaultSort: OrderSort = 'newest';

/**
 * Reads the filters from URL search params. A value the API would refuse (an unknown status, a
 * date that is not a date) is dropped, so a hand-edited URL still shows orders.
 */
export function parseRoasteryOrderFilters(search: URLSearchParams): RoasteryOrderFilters {
  const shape = orderListQuerySchema.shape;
  const sort = shape.sort.safeParse(search.get('sort') ?? undefined);
  const page = shape.page.safeParse(search.get('page') ?? undefined);
  const filters: RoasteryOrderFilters = { sort: sort.success ? sort.data : defaultSort, page: page.success ? page.data : 1 };
  for (const key of filterKeys) {
    const raw = search.get(key);
    if (raw === null || raw.trim() === '') continue;
    const parsed = shape[key].safeParse(raw);
    if (parsed.success && parsed.data !== undefined) assign(filters, key, parsed.data);
  }
  return filters;
}

function assign<K extends FilterKey>(filters: RoasteryOrderFilters, key: K, value: NonNullable<RoasteryOrderFilters[K]>): void {
  filters[key] = value;
}

/** The page URL's search params: only what differs from the defaults, in a stable order. */
export function roasteryOrderFiltersToSearchParams(filters: RoasteryOrderFilters): URLSearchParams {
  const search = new URLSearchParams();
  for (const key of filterKeys) {
    const value = filters[key];
    if (value !== undefined && value !== '') search.set(key, value);
  }
  if (filters.sort !== defaultSort) search.set('sort', filters.sort);
  if (filters.page > 1) search.set('page', String(filters.page));
  return search;
}

/** `GET /api/orders.csv` for the same filters and order: every matching order, not just this page. */
export function ordersCsvHref(filters: RoasteryOrderFilters): string {
  const search = roasteryOrderFiltersToSearchParams({ ...filters, page: 1 });
  const query = search.toString();
  return query ? `/api/orders.csv?${query}` : '/api/orders.csv';
}

/** Why the API would refuse these filters, by field (today only a backwards date range), or nothing. */
export function roasteryOrderFilterProblems(filters: RoasteryOrderFilters): Partial<Record<FilterKey, string>> {
  const result = orderListQuerySchema.safeParse(Object.fromEntries(roasteryOrderFiltersToSearchParams(filters)));
  if (result.success) return {};
  const problems: Partial<Record<FilterKey, string>> = {};
  for (const issue of result.error.issues) {
    const key = issue.path[0];
    if (typeof key === 'string' && (filterKeys as readonly string[]).includes(key)) problems[key as FilterKey] ??= issue.message;
  }
  return problems;
}

export function hasActiveFilters(filters: RoasteryOrderFilters): boolean {
  return filterKeys.some((key) => filters[key] !== undefined);
}
