import { queryOptions, useQuery } from '@tanstack/react-query';
import { lotDetailSchema, type LotDetail } from '@shared/schemas/lots';
import { apiRequest } from '@/lib/api-client';

/**
 * A lot's descriptors, photos and spec sheet for the editor. The API reads them through the
 * public lot route, which serves listed lots only; after a save the cache holds what the server
 * answered, unlisted or not.
 */
export function getEditableLot({ code, signal }: { code: string; signal?: AbortSignal }): Promise<LotDetail> {
  return apiRequest(`/api/lots/${encodeURIComponent(code)}`, { schema: lotDetailSchema, signal });
}

export function getEditableLotQueryOptions(code: string) {
  return queryOptions({
    queryKey: ['green-stock', 'lot', code],
    queryFn: ({ signal }) => getEditableLot({ code, signal }),
  });
}

export function useEditableLot(code: string) {
  return useQuery(getEditableLotQueryOptions(code));
}
