import { queryOptions, useQuery } from '@tanstack/react-query';
import { rotationResponseSchema, type RotationResponse } from '@shared/schemas/rotation';
import { apiRequest } from '@/lib/api-client';

/** The open roast days from `from` to `to` (shop days, inclusive) and the Roaster's Rotation on each. */
export function getRotation({ from, to, signal }: { from: string; to: string; signal?: AbortSignal }): Promise<RotationResponse> {
  return apiRequest('/api/roastery/rotation', { schema: rotationResponseSchema, params: new URLSearchParams({ from, to }), signal });
}

export function getRotationQueryOptions(range: { from: string; to: string }) {
  return queryOptions({
    queryKey: ['rotation', range],
    queryFn: ({ signal }) => getRotation({ ...range, signal }),
  });
}

export function useRotation(range: { from: string; to: string }) {
  return useQuery(getRotationQueryOptions(range));
}
