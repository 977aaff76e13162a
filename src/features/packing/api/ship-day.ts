import { useMutation, useQueryClient } from '@tanstack/react-query';
import { packListResponseSchema, type BulkShipBody, type PackListResponse } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';
import { getPackListQueryOptions } from './get-pack-list';

/** Marks every listed packed order of the day shipped with one carrier, all or none; each customer gets their shipped e-mail. */
export function shipDay({ date, body }: { date: string; body: BulkShipBody }): Promise<PackListResponse> {
  return apiRequest(`/api/roastery/days/${encodeURIComponent(date)}/ship`, { method: 'POST', body, schema: packListResponseSchema });
}

export function useShipDay(date: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: shipDay,
    onSuccess: (packList) => queryClient.setQueryData(getPackListQueryOptions(date).queryKey, packList),
  });
}
