import { useMutation, useQueryClient } from '@tanstack/react-query';
import { lotStaffDetailSchema, type LotCreate, type LotStaffDetail, type LotUpdate } from '@shared/schemas/lots';
import { apiRequest } from '@/lib/api-client';
import { getEditableLotQueryOptions } from './get-editable-lot';
import { getGreenStockQueryOptions } from './get-green-stock';

/** Adds a lot; it starts with no stock (its first stock is an arrival). */
export function createLot(input: LotCreate): Promise<LotStaffDetail> {
  return apiRequest('/api/lots', { method: 'POST', body: input, schema: lotStaffDetailSchema });
}

/** Changes only the fields in `patch`; the server checks the lot they leave behind. */
export function updateLot({ code, patch }: { code: string; patch: LotUpdate }): Promise<LotStaffDetail> {
  return apiRequest(`/api/lots/${encodeURIComponent(code)}`, { method: 'PATCH', body: patch, schema: lotStaffDetailSchema });
}

/** What the server answered is the lot as it now is: the editor shows it, Green Stock reloads. */
function useRememberSavedLot() {
  const queryClient = useQueryClient();
  return async (lot: LotStaffDetail) => {
    queryClient.setQueryData(getEditableLotQueryOptions(lot.code).queryKey, lot);
    await queryClient.invalidateQueries({ queryKey: getGreenStockQueryOptions().queryKey });
  };
}

export function useCreateLot() {
  const remember = useRememberSavedLot();
  return useMutation({ mutationFn: createLot, onSuccess: remember });
}

export function useUpdateLot() {
  const remember = useRememberSavedLot();
  return useMutation({ mutationFn: updateLot, onSuccess: remember });
}
