import { queryOptions, useQuery } from '@tanstack/react-query';
import { batchTraceSchema, type BatchTrace } from '@shared/schemas/packing';
import { apiRequest } from '@/lib/api-client';

/** One batch and every order its coffee went into. */
export function getBatchTrace({ id, signal }: { id: string; signal?: AbortSignal }): Promise<BatchTrace> {
  return apiRequest(`/api/roastery/batches/${encodeURIComponent(id)}/trace`, { schema: batchTraceSchema, signal });
}

export function getBatchTraceQueryOptions(id: string) {
  return queryOptions({
    queryKey: ['roastery', 'batch-trace', id],
    queryFn: ({ signal }) => getBatchTrace({ id, signal }),
  });
}

export function useBatchTrace(id: string) {
  return useQuery(getBatchTraceQueryOptions(id));
}
