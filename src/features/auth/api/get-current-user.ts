import { queryOptions, useQuery } from '@tanstack/react-query';
import { meResponseSchema, type User } from '@shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';

/** Who is signed in on this browser, or `null` for a visitor. */
export async function getCurrentUser({ signal }: { signal?: AbortSignal } = {}): Promise<User | null> {
  const { user } = await apiRequest('/api/auth/me', { schema: meResponseSchema, signal });
  return user;
}

/** The one source of session state: the header, the guards and every auth mutation use this key. */
export function getCurrentUserQueryOptions() {
  return queryOptions({
    queryKey: ['auth', 'me'],
    queryFn: ({ signal }) => getCurrentUser({ signal }),
  });
}

export function useCurrentUser() {
  return useQuery(getCurrentUserQueryOptions());
}
