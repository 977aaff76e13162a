import { queryOptions, useQuery } from '@tanstack/react-query';
import { ledgerResponseSchema, type LedgerResponse, type LedgerTable } from '@shared/schemas/ledger';
import { apiRequest } from '@/lib/api-client';

/** The owner's Ledger over the last `weeks` weeks. */
export function getLedger(weeks: number, { signal }: { signal?: AbortSignal } = {}): Promise<LedgerResponse> {
  return apiRequest(`/api/owner/ledger?weeks=${weeks}`, { schema: ledgerResponseSchema, signal });
}

export function getLedgerQueryOptions(weeks: number) {
  return queryOptions({ queryKey: ['owner', 'ledger', weeks], queryFn: ({ signal }) => getLedger(weeks, { signal }) });
}

export function useLedger(weeks: number) {
  return useQuery(getLedgerQueryOptions(weeks));
}

export const ledgerCsvHref = (table: LedgerTable, weeks: number) => `/api/owner/ledger/${table}.csv?weeks=${weeks}`;
