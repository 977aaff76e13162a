import { useMutation, useQueryClient } from '@tanstack/react-query';
import { rotationPickResponseSchema, type RotationPick, type RotationPickResponse } from '@shared/schemas/rotation';
import { apiRequest } from '@/lib/api-client';
import { getRotationQueryOptions } from './get-rotation';

/** Sets the lot the Roaster's Rotation subscribers get on one roast day. */
export function pickRotationLot({ roastDate, pick }: { roastDate: string; pick: RotationPick }): Promise<RotationPickResponse> {
  return apiRequest(`/api/roastery/rotation/${encodeURIComponent(roastDate)}`, { method: 'PUT', body: pick, schema: rotationPickResponseSchema });
}

export function usePickRotationLot(range: { from: string; to: string }) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: pickRotationLot,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getRotationQueryOptions(range).queryKey }),
  });
}
