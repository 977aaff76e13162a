import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { lotListResponseSchema, type LotListResponse } from '@shared/schemas/lots';
import { apiRequest } from '@/lib/api-client';
import { lotFiltersToSearchParams, type LotFilters } from '../utils/lot-filters';

export function getLots({ filters, signal }: { filters: LotFilters; signal?: AbortSignal }): Promise<LotListResponse> {
  return apiRequest('/api/lots', { schema: lotListResponseSchema, params: lotFiltersToSearchParams(filters), signal });
}

export function getLotsQueryOptions(filters: LotFilters = {}) {
  return queryOptions({
    queryKey: ['lots', 'list', filters],
    queryFn: ({ signal }) => getLots({ filters, signal }),
  });
}

/** While new filters load, the previous results stay on screen (`isPlaceholderData`) instead of blanking. */
export function useLots(filters: LotFilters = {}) {
  return useQuery({ ...getLotsQueryOptions(filters), placeholderData: keepPreviousData });
}
