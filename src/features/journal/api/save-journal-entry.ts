import { useMutation, useQueryClient } from '@tanstack/react-query';
import { journalEntryCreatedSchema, type JournalEntryCreated, type JournalEntryInput } from '@shared/schemas/journal';
import { apiRequest } from '@/lib/api-client';
import { journalListsKey } from './get-journal';

/** Logs a new roast (no id) or changes one of the customer's own (with its id). */
export function saveJournalEntry({ id, input }: { id?: string; input: JournalEntryInput }): Promise<JournalEntryCreated> {
  return id
    ? apiRequest(`/api/journal/${encodeURIComponent(id)}`, { method: 'PUT', body: input, schema: journalEntryCreatedSchema })
    : apiRequest('/api/journal', { method: 'POST', body: input, schema: journalEntryCreatedSchema });
}

export function useSaveJournalEntry() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveJournalEntry,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: journalListsKey }),
  });
}
