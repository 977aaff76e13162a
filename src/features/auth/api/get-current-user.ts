import { queryOptions, useQuery } from '@tanstack/react-query';
import { meResponseSchema, type User } from '@shared/schemas/auth';
import { ApiError, apiRequest } from '@/lib/api-client';

/** Who is signed in on this browser, or `null` for a visitor (the server answers 401). */
export async function getCurrentUser({ signal }: { signal?: AbortSignal } = {}): Promise<User | null> {
  try {
    const { user } = await apiRequest('/api/auth/me', { schema: meResponseSchema, signal });
    return user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
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
