import { subscriberListQuerySchema, type SubscriberListQuery } from '@shared/schemas/subscribers';

/** The Subscribers table's filters and page, as kept in the page URL and sent to the API. */
export type SubscriberFilters = Partial<Pick<SubscriberListQuery, 'status' | 'level' | 'cadence' | 'lot' | 'q' | 'sort'>> & { page: number };

const filterKeys = ['status', 'level', 'cadence', 'lot', 'q', 'sort'] as const;

/** Reads the filters from the URL; a value the API would refuse is dropped rather than sent. */
export function parseSubscriberFilters(search: URLSearchParams): SubscriberFilters {
  const shape = subscriberListQuerySchema.shape;
  const filters: SubscriberFilters = { page: 1 };
  for (const key of filterKeys) {
    const raw = search.get(key);
    if (raw === null || raw.trim() === '') continue;
    const parsed = shape[key].safeParse(raw);
    if (parsed.success && parsed.data !== undefined) Object.assign(filters, { [key]: parsed.data });
  }
  // Newest first is the API's own order, so it stays out of the URL.
  if (filters.sort === 'newest') delete filters.sort;
  const page = shape.page.safeParse(search.get('page') ?? undefined);
  if (page.success) filters.page = page.data;
  return filters;
}

/** The filters as search parameters, in a stable order; `page` only past the first. */
export function subscriberFiltersToSearch(filters: SubscriberFilters, { withPage = true }: { withPage?: boolean } = {}): URLSearchParams {
  const search = new URLSearchParams();
  for (const key of filterKeys) {
    const value = filters[key];
    if (value !== undefined && value !== '') search.set(key, String(value));
  }
  if (withPage && filters.page > 1) search.set('page', String(filters.page));
  return search;
}
