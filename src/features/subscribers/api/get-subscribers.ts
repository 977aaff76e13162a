import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { subscriberListResponseSchema, type SubscriberListResponse } from '@shared/schemas/subscribers';
import { apiRequest } from '@/lib/api-client';
import { subscriberFiltersToSearch, type SubscriberFilters } from '../utils/subscriber-filters';

/** Rows per page of the Subscribers table. */
export const SUBSCRIBERS_PAGE_SIZE = 25;

export function getSubscribers({ filters, signal }: { filters: SubscriberFilters; signal?: AbortSignal }): Promise<SubscriberListResponse> {
  const params = subscriberFiltersToSearch(filters, { withPage: false });
  params.set('page', String(filters.page));
  params.set('pageSize', String(SUBSCRIBERS_PAGE_SIZE));
  return apiRequest('/api/roastery/subscribers', { schema: subscriberListResponseSchema, params, signal });
}

export function getSubscribersQueryOptions(filters: SubscriberFilters) {
  return queryOptions({
    queryKey: ['subscribers', 'list', filters],
    queryFn: ({ signal }) => getSubscribers({ filters, signal }),
  });
}

/** While another page or filter loads, the previous rows stay on screen. */
export function useSubscribers(filters: SubscriberFilters) {
  return useQuery({ ...getSubscribersQueryOptions(filters), placeholderData: keepPreviousData });
}

/** The CSV export of every subscriber matching the same filters (all pages). */
export function subscribersCsvHref(filters: SubscriberFilters): string {
  const query = subscriberFiltersToSearch(filters, { withPage: false }).toString();
  return query ? `/api/roastery/subscribers.csv?${query}` : '/api/roastery/subscribers.csv';
}
