import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PostalAddressInput } from '@shared/schemas/address';
import { orderDetailSchema, type OrderDetail, type OrderNoteInput, type ResendableTemplate } from '@shared/schemas/orders';
import { apiRequest } from '@/lib/api-client';
import { showChangedOrder } from './order-desk-cache';

const orderPath = (id: string) => `/api/orders/${encodeURIComponent(id)}`;

/** Staff's actions on one order; each answers with the order as it now is. */
export const orderActions = {
  cancel: ({ id }: { id: string }): Promise<OrderDetail> => apiRequest(`${orderPath(id)}/cancel`, { method: 'POST', schema: orderDetailSchema }),
  resend: ({ id, template }: { id: string; template: ResendableTemplate }): Promise<OrderDetail> =>
    apiRequest(`${orderPath(id)}/resend/${template}`, { method: 'POST', schema: orderDetailSchema }),
  correctAddress: ({ id, address }: { id: string; address: PostalAddressInput }): Promise<OrderDetail> =>
    apiRequest(`${orderPath(id)}/address`, { method: 'PATCH', body: address, schema: orderDetailSchema }),
  saveNote: ({ id, note }: { id: string } & OrderNoteInput): Promise<OrderDetail> =>
    apiRequest(`${orderPath(id)}/note`, { method: 'PUT', body: { note }, schema: orderDetailSchema }),
};

export function useOrderAction<Input>(action: (input: Input) => Promise<OrderDetail>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: action, onSuccess: (changed) => showChangedOrder(queryClient, changed) });
}
