import type { QueryClient } from '@tanstack/react-query';
import { redirect } from 'react-router-dom';
import type { User } from '@shared/schemas/auth';
import { getCurrentUserQueryOptions } from '../api/get-current-user';
import { safeRedirectTo, signInHrefFor } from './redirect-to';

/**
 * For a route loader: the signed-in user, or a redirect to sign-in that comes back to this page.
 * Only a convenience: the server checks the session and role on every request whatever this says.
 */
export async function requireUser(queryClient: QueryClient, request: Request): Promise<User> {
  const user = await queryClient.fetchQuery(getCurrentUserQueryOptions());
  if (!user) throw redirect(signInHrefFor(new URL(request.url)));
  return user;
}

/** For the sign-in and create-account loaders: someone already signed in goes on to where they were headed. */
export async function redirectIfSignedIn(queryClient: QueryClient, request: Request): Promise<null> {
  const user = await queryClient.fetchQuery(getCurrentUserQueryOptions());
  if (user) throw redirect(safeRedirectTo(new URL(request.url).searchParams));
  return null;
}

/** A layout's loader that only guards: a visitor goes to sign in and comes back afterwards. */
export const signedInLoader =
  (queryClient: QueryClient) =>
  async ({ request }: { request: Request }): Promise<null> => {
    await requireUser(queryClient, request);
    return null;
  };
