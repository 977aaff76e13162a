import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { HomeRoastDevice, RoastLevel } from '@shared/domain/vocabulary';
import { homeRoastGuideSchema, type HomeRoastGuideResponse } from '@shared/schemas/home-roast-guide';
import { apiRequest } from '@/lib/api-client';

export type RoastGuideRequest = { code: string; device: HomeRoastDevice; greenGrams: number; level: RoastLevel };

export function getRoastGuide({ code, device, greenGrams, level, signal }: RoastGuideRequest & { signal?: AbortSignal }): Promise<HomeRoastGuideResponse> {
  return apiRequest(`/api/lots/${encodeURIComponent(code)}/roast-guide`, {
    schema: homeRoastGuideSchema,
    params: new URLSearchParams({ device, greenGrams: String(greenGrams), level }),
    signal,
  });
}

export function getRoastGuideQueryOptions(request: RoastGuideRequest) {
  return queryOptions({
    queryKey: ['lots', 'roast-guide', request],
    queryFn: ({ signal }) => getRoastGuide({ ...request, signal }),
  });
}

/** While another size or level loads, the previous guide stays on screen instead of blanking. */
export function useRoastGuide(request: RoastGuideRequest) {
  return useQuery({ ...getRoastGuideQueryOptions(request), placeholderData: keepPreviousData });
}
