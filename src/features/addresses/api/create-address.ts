import { useMutation, useQueryClient } from '@tanstack/react-query';
import { addressSchema, type Address, type AddressInput } from '@shared/schemas/account';
import { apiRequest } from '@/lib/api-client';
import { getAddressesQueryOptions } from './get-addresses';

export function createAddress(input: AddressInput): Promise<Address> {
  return apiRequest('/api/account/addresses', { method: 'POST', body: input, schema: addressSchema });
}

export function useCreateAddress() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAddress,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getAddressesQueryOptions().queryKey }),
  });
}
