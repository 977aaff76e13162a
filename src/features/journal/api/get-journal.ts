import { queryOptions, useQuery } from '@tanstack/react-query';
import { journalListResponseSchema, type JournalListQuery, type JournalListResponse } from '@shared/schemas/journal';
import { apiRequest } from '@/lib/api-client';

/** The signed-in customer's Roast Journal, newest roast first, and the lots they may log. */
export function getJournal(filter: JournalListQuery, { signal }: { signal?: AbortSignal } = {}): Promise<JournalListResponse> {
  const search = new URLSearchParams();
  if (filter.lotCode) search.set('lotCode', filter.lotCode);
  if (filter.device) search.set('device', filter.device);
  return apiRequest('/api/journal', { schema: journalListResponseSchema, params: search, signal });
}

export function getJournalQueryOptions(filter: JournalListQuery = {}) {
  return queryOptions({
    queryKey: ['journal', 'list', filter],
    queryFn: ({ signal }) => getJournal(filter, { signal }),
  });
}

/** Every list of the journal, whatever its filter: what a change invalidates. */
export const journalListsKey = ['journal', 'list'] as const;

export function useJournal(filter: JournalListQuery = {}) {
  return useQuery(getJournalQueryOptions(filter));
}
