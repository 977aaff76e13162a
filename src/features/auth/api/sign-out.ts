import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError, apiRequest } from '@/lib/api-client';
import { replaceSession } from '../utils/replace-session';

/** Ends this browser's session. A session that had already ended counts as signed out. */
export async function signOut(): Promise<void> {
  try {
    await apiRequest('/api/auth/sign-out', { method: 'POST', schema: z.undefined() });
  } catch (error) {
    if (!(error instanceof ApiError && error.status === 401)) throw error;
  }
}

/** `onSignedOut` runs before the session is cleared, so a page that needs a user can be left first. */
export function useSignOut({ onSignedOut }: { onSignedOut?: () => Promise<void> | void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      await onSignedOut?.();
      await replaceSession(queryClient, null);
    },
  });
}
