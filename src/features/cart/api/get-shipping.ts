import { queryOptions, useQuery } from '@tanstack/react-query';
import { shippingRulesSchema, type ShippingRules } from '@shared/schemas/shipping';
import { apiRequest } from '@/lib/api-client';

/** The shop's shipping bands and tares (`GET /api/shipping`), which the cart prices parcels with. */
export function getShipping({ signal }: { signal?: AbortSignal } = {}): Promise<ShippingRules> {
  return apiRequest('/api/shipping', { schema: shippingRulesSchema, signal });
}

export function getShippingQueryOptions() {
  return queryOptions({
    queryKey: ['shipping'],
    queryFn: ({ signal }) => getShipping({ signal }),
    // Asked again whenever the cart or checkout shows (the server answers 304 while the bands are
    // unchanged), so a cart never quotes on bands the owner has since changed.
    staleTime: 0,
    refetchOnWindowFocus: true,
  });
}

export function useShipping() {
  return useQuery(getShippingQueryOptions());
}
