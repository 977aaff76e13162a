import { queryOptions, useQuery } from '@tanstack/react-query';
import { addressListResponseSchema, type AddressListResponse } from '@shared/schemas/account';
import { apiRequest } from '@/lib/api-client';

/** The signed-in customer's shipping addresses, the default first. */
export function getAddresses({ signal }: { signal?: AbortSignal } = {}): Promise<AddressListResponse> {
  return apiRequest('/api/account/addresses', { schema: addressListResponseSchema, signal });
}

export function getAddressesQueryOptions() {
  return queryOptions({
    queryKey: ['addresses', 'list'],
    queryFn: ({ signal }) => getAddresses({ signal }),
  });
}

export function useAddresses() {
  return useQuery(getAddressesQueryOptions());
}
