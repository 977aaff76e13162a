import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type SignUpInput, type User } from '@shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { replaceSession } from '../utils/replace-session';

/** Creates a customer account and signs it in. */
export async function signUp(input: SignUpInput): Promise<User> {
  const { user } = await apiRequest('/api/auth/sign-up', { method: 'POST', body: input, schema: userResponseSchema });
  return user;
}

export function useSignUp({ onSuccess }: { onSuccess?: (user: User) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: async (user) => {
      await replaceSession(queryClient, user);
      onSuccess?.(user);
    },
  });
}
