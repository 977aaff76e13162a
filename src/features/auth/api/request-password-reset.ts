import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { PasswordResetRequest } from '@shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';

/** Asks for a reset link by e-mail. The answer is the same whether or not the address has an account. */
export async function requestPasswordReset(input: PasswordResetRequest): Promise<void> {
  await apiRequest('/api/auth/password-reset', { method: 'POST', body: input, schema: z.unknown() });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
