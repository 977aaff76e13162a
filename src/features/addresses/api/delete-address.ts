import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { getAddressesQueryOptions } from './get-addresses';

export async function deleteAddress(id: string): Promise<void> {
  await apiRequest(`/api/account/addresses/${encodeURIComponent(id)}`, { method: 'DELETE', schema: z.undefined() });
}

export function useDeleteAddress() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAddress,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getAddressesQueryOptions().queryKey }),
  });
}
