import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { ordersQueryKey } from './get-orders';

/** "Discard": the unpaid order is cancelled, its bags go back to stock, and it leaves the history. */
export async function discardOrder(id: string): Promise<void> {
  await apiRequest(`/api/orders/${encodeURIComponent(id)}/discard`, { method: 'POST', schema: z.undefined() });
}

export function useDiscardOrder() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: discardOrder, onSuccess: () => queryClient.invalidateQueries({ queryKey: ordersQueryKey }) });
}
