import { queryOptions, useQuery } from '@tanstack/react-query';
import { formatMoney } from '@shared/domain/money';
import { shippingRulesSchema } from '@shared/schemas/shipping';
import { apiRequest } from '@/lib/api-client';

/**
 * The currency the shop sells in, from its settings as `GET /api/shipping` publishes them to
 * everyone. It changes rarely, so it is asked once per few minutes rather than on every screen
 * (the cart asks the same endpoint afresh for the bands it prices with).
 */
export function getShopCurrencyQueryOptions() {
  return queryOptions({
    queryKey: ['shop', 'currency'],
    queryFn: async ({ signal }) => (await apiRequest('/api/shipping', { schema: shippingRulesSchema, signal })).currency,
    staleTime: 5 * 60_000,
  });
}

/**
 * Formatters for minor units in the shop's currency. Until that currency is known an amount reads
 * as nothing, never as a guess in another currency.
 */
export function useShopMoney() {
  const currency = useQuery(getShopCurrencyQueryOptions()).data;
  const money = (minor: number) => (currency ? formatMoney(minor, currency) : '');
  return {
    money,
    /** 2450 usd → "$24.50 / kg" */
    pricePerKg: (minor: number) => (currency ? `${money(minor)} / kg` : ''),
  };
}
