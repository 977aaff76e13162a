import type { QueryClient } from '@tanstack/react-query';
import type { User } from '@shared/schemas/auth';
import { getCurrentUserQueryOptions } from '../api/get-current-user';

/**
 * Records who is now signed in (or that no one is) and drops everything else cached, so nothing
 * one person loaded is ever shown to the next. After a sign-in the pages on screen load their data
 * again; after a sign-out nothing is fetched, since a page still on screen for a moment may be one
 * only the person who just left could read, and asking would only earn a 401.
 */
export async function replaceSession(queryClient: QueryClient, user: User | null): Promise<void> {
  const { queryKey } = getCurrentUserQueryOptions();
  queryClient.setQueryData(queryKey, user);
  const sessionHash = queryClient.getQueryCache().find({ queryKey, exact: true })?.queryHash;
  const everythingElse = { predicate: (query: { queryHash: string }) => query.queryHash !== sessionHash };
  if (user === null) queryClient.removeQueries(everythingElse);
  else await queryClient.resetQueries(everythingElse);
}
