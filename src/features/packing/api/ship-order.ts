import { useMutation, useQueryClient } from '@tanstack/react-query';
import { packOrderSchema, type PackOrder, type ShipOrderBody } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';
import { getPackListQueryOptions } from './get-pack-list';

/** Marks an order shipped with its carrier and tracking number; the customer's shipped e-mail follows. */
export function shipOrder({ orderId, shipment }: { orderId: string; shipment: ShipOrderBody }): Promise<PackOrder> {
  return apiRequest(`/api/orders/${encodeURIComponent(orderId)}/ship`, { method: 'POST', body: shipment, schema: packOrderSchema });
}

export function useShipOrder(date: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: shipOrder,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getPackListQueryOptions(date).queryKey }),
  });
}
