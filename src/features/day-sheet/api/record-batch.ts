import { useMutation, useQueryClient } from '@tanstack/react-query';
import { batchCreatedSchema, type BatchCreate, type BatchCreated } from '@shared/schemas/roastery';
import { apiRequest } from '@/lib/api-client';
import { getDayBatchesQueryOptions } from './get-day-batches';
import { getRoastListQueryOptions } from './get-roast-list';

/** Records one roasted batch; the server takes its green out of stock in the same transaction. */
export function recordBatch(input: BatchCreate): Promise<BatchCreated> {
  return apiRequest('/api/roastery/batches', { method: 'POST', body: input, schema: batchCreatedSchema });
}

export function useRecordBatch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordBatch,
    onSuccess: (_batch, input) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: getRoastListQueryOptions(input.roastDate).queryKey }),
        queryClient.invalidateQueries({ queryKey: getDayBatchesQueryOptions(input.roastDate).queryKey }),
      ]),
  });
}
