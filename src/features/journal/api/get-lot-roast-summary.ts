import { queryOptions, useQuery } from '@tanstack/react-query';
import { lotRoastSummaryResponseSchema, type LotRoastSummaryResponse } from '@shared/schemas/journal-summary';
import { apiRequest } from '@/lib/api-client';

/** Who reads the figures: the public lot page, or staff (the same figures, from the Roastery's own route). */
export type SummaryAudience = 'public' | 'staff';

const urlOf = (code: string, audience: SummaryAudience) =>
  audience === 'public' ? `/api/lots/${encodeURIComponent(code)}/home-roasts` : `/api/roastery/lots/${encodeURIComponent(code)}/journal-summary`;

/** Home roasters' anonymous figures for one lot; `summary` is null below the minimum roasts and customers. */
export function getLotRoastSummary(code: string, audience: SummaryAudience, { signal }: { signal?: AbortSignal } = {}): Promise<LotRoastSummaryResponse> {
  return apiRequest(urlOf(code, audience), { schema: lotRoastSummaryResponseSchema, signal });
}

export function getLotRoastSummaryQueryOptions(code: string, audience: SummaryAudience) {
  return queryOptions({
    queryKey: ['journal', 'lot-summary', audience, code],
    queryFn: ({ signal }) => getLotRoastSummary(code, audience, { signal }),
  });
}

export function useLotRoastSummary(code: string, audience: SummaryAudience) {
  return useQuery(getLotRoastSummaryQueryOptions(code, audience));
}
