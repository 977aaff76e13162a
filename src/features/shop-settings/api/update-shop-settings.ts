import { useMutation, useQueryClient } from '@tanstack/react-query';
import { shopSettingsSchema, type ShopSettings } from '@shared/schemas/settings';
import { apiRequest } from '@/lib/api-client';
import { getShopCurrencyQueryOptions } from '@/lib/shop-currency';
import { getShopSettingsQueryOptions } from './get-shop-settings';

/** Replaces the shop settings as a whole; the server checks them with the same schema as the form. */
export function updateShopSettings(settings: ShopSettings): Promise<ShopSettings> {
  return apiRequest('/api/roastery/settings', { method: 'PUT', body: settings, schema: shopSettingsSchema });
}

export function useUpdateShopSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateShopSettings,
    onSuccess: (saved) => {
      queryClient.setQueryData(getShopSettingsQueryOptions().queryKey, saved);
      queryClient.setQueryData(getShopCurrencyQueryOptions().queryKey, saved.currency);
    },
  });
}
