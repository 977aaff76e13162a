import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type User } from '@shared/schemas/auth';
import type { ProfileUpdate } from '@shared/schemas/account';
import { apiRequest } from '@/lib/api-client';
import { getCurrentUserQueryOptions } from './get-current-user';

export async function updateProfile(input: ProfileUpdate): Promise<User> {
  const { user } = await apiRequest('/api/account/profile', { method: 'PATCH', body: input, schema: userResponseSchema });
  return user;
}

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    onSuccess: (user) => queryClient.setQueryData(getCurrentUserQueryOptions().queryKey, user),
  });
}
