import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { PasswordResetConfirm } from '@shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { getCurrentUserQueryOptions } from './get-current-user';

/** Sets a new password with the token from the e-mailed link; every session of the account ends. */
export async function resetPassword(input: PasswordResetConfirm): Promise<void> {
  await apiRequest('/api/auth/password-reset/confirm', { method: 'POST', body: input, schema: z.undefined() });
}

export function useResetPassword({ onSuccess }: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    onSuccess: async () => {
      // If this browser was signed in to the account, that session has just ended.
      await queryClient.invalidateQueries({ queryKey: getCurrentUserQueryOptions().queryKey });
      onSuccess?.();
    },
  });
}
