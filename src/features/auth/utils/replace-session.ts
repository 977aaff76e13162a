import type { QueryClient } from '@tanstack/react-query';
import type { User } from '@shared/schemas/auth';
import { getCurrentUserQueryOptions } from '../api/get-current-user';

/**
 * Records who is now signed in (or that no one is) and resets everything else cached, so nothing
 * one person loaded is ever shown to the next; pages on screen load their data again.
 */
export async function replaceSession(queryClient: QueryClient, user: User | null): Promise<void> {
  const { queryKey } = getCurrentUserQueryOptions();
  queryClient.setQueryData(queryKey, user);
  const sessionHash = queryClient.getQueryCache().find({ queryKey, exact: true })?.queryHash;
  await queryClient.resetQueries({ predicate: (query) => query.queryHash !== sessionHash });
}
