import { useMutation, useQueryClient } from '@tanstack/react-query';
import { addressSchema, type Address, type AddressInput } from '@shared/schemas/account';
import { apiRequest } from '@/lib/api-client';
import { getAddressesQueryOptions } from './get-addresses';

export function updateAddress({ id, input }: { id: string; input: AddressInput }): Promise<Address> {
  return apiRequest(`/api/account/addresses/${encodeURIComponent(id)}`, { method: 'PUT', body: input, schema: addressSchema });
}

/** Edits an address, or makes it the default (which un-defaults the previous one on the server). */
export function useUpdateAddress() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAddress,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getAddressesQueryOptions().queryKey }),
  });
}
