import { queryOptions, useQuery } from '@tanstack/react-query';
import { lotDetailSchema, type LotDetail } from '@shared/schemas/lots';
import { apiRequest } from '@/lib/api-client';

export function getLot({ code, signal }: { code: string; signal?: AbortSignal }): Promise<LotDetail> {
  return apiRequest(`/api/lots/${encodeURIComponent(code)}`, { schema: lotDetailSchema, signal });
}

export function getLotQueryOptions(code: string) {
  return queryOptions({
    queryKey: ['lots', 'detail', code],
    queryFn: ({ signal }) => getLot({ code, signal }),
  });
}

export function useLot(code: string) {
  return useQuery(getLotQueryOptions(code));
}
