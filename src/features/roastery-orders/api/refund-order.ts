import { useMutation, useQueryClient } from '@tanstack/react-query';
import { refundResponseSchema, type RefundOrderBody, type RefundResponse } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';
import { getRoasteryOrderQueryOptions } from './get-roastery-order';

type RefundInput = { id: string; body: RefundOrderBody; refundKey: string };

/** The owner's refund, in full (no amount) or in part; one key per refund meant, so a retry never refunds twice. */
export function refundOrder({ id, body, refundKey }: RefundInput): Promise<RefundResponse> {
  return apiRequest(`/api/orders/${encodeURIComponent(id)}/refund`, {
    method: 'POST',
    body,
    headers: { 'Idempotency-Key': refundKey },
    schema: refundResponseSchema,
  });
}

export function useRefundOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: refundOrder,
    // The order's own figures change when the payment provider confirms the refund; read it again.
    onSuccess: (_answer, { id }) => queryClient.invalidateQueries({ queryKey: getRoasteryOrderQueryOptions(id).queryKey }),
  });
}
