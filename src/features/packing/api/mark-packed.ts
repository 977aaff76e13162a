import { useMutation, useQueryClient } from '@tanstack/react-query';
import { packOrderSchema, type PackOrder } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';
import { getPackListQueryOptions } from './get-pack-list';

/** Marks an order's bags packed; the server fills each bag from a batch of its lot and level. */
export function markPacked(orderId: string): Promise<PackOrder> {
  return apiRequest(`/api/orders/${encodeURIComponent(orderId)}/pack`, { method: 'POST', schema: packOrderSchema });
}

export function useMarkPacked(date: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markPacked,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getPackListQueryOptions(date).queryKey }),
  });
}
