import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type SignInInput, type User } from '@shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { replaceSession } from '../utils/replace-session';

export async function signIn(input: SignInInput): Promise<User> {
  const { user } = await apiRequest('/api/auth/sign-in', { method: 'POST', body: input, schema: userResponseSchema });
  return user;
}

export function useSignIn({ onSuccess }: { onSuccess?: (user: User) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: async (user) => {
      await replaceSession(queryClient, user);
      onSuccess?.(user);
    },
  });
}
