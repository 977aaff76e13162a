import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type User } from '@shared/schemas/auth';
import type { EmailChange } from '@shared/schemas/account';
import { apiRequest } from '@/lib/api-client';
import { getCurrentUserQueryOptions } from './get-current-user';

/** Moves the account to a new address; the current password proves it is the account's holder. */
export async function changeEmail(input: EmailChange): Promise<User> {
  const { user } = await apiRequest('/api/account/email', { method: 'PUT', body: input, schema: userResponseSchema });
  return user;
}

export function useChangeEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeEmail,
    onSuccess: (user) => queryClient.setQueryData(getCurrentUserQueryOptions().queryKey, user),
  });
}
