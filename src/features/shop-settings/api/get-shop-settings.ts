import { queryOptions, useQuery } from '@tanstack/react-query';
import { shopSettingsSchema, type ShopSettings } from '@shared/schemas/settings';
import { apiRequest } from '@/lib/api-client';

export function getShopSettings({ signal }: { signal?: AbortSignal } = {}): Promise<ShopSettings> {
  return apiRequest('/api/roastery/settings', { schema: shopSettingsSchema, signal });
}

export function getShopSettingsQueryOptions() {
  return queryOptions({
    queryKey: ['roastery', 'settings'],
    queryFn: ({ signal }) => getShopSettings({ signal }),
  });
}

export function useShopSettings() {
  return useQuery(getShopSettingsQueryOptions());
}
