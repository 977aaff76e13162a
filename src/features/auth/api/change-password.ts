import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { PasswordChange } from '@shared/schemas/account';
import { apiRequest } from '@/lib/api-client';

/** Every other session of the account ends; the server hands this browser a fresh one, so it stays signed in. */
export async function changePassword(input: PasswordChange): Promise<void> {
  await apiRequest('/api/account/password', { method: 'PUT', body: input, schema: z.undefined() });
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
