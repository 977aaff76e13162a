import { queryOptions, useQuery } from '@tanstack/react-query';
import { lotStaffDetailSchema, type LotDetail } from '@shared/schemas/lots';
import { apiRequest } from '@/lib/api-client';

/** A lot's descriptors, photos and spec sheet for the editor, listed or not. */
export function getEditableLot({ code, signal }: { code: string; signal?: AbortSignal }): Promise<LotDetail> {
  return apiRequest(`/api/roastery/green-stock/${encodeURIComponent(code)}`, { schema: lotStaffDetailSchema, signal });
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
