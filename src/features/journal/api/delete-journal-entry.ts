import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { journalListsKey } from './get-journal';

export async function deleteJournalEntry(id: string): Promise<void> {
  await apiRequest(`/api/journal/${encodeURIComponent(id)}`, { method: 'DELETE', schema: z.undefined() });
}

export function useDeleteJournalEntry() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteJournalEntry,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: journalListsKey }),
  });
}
