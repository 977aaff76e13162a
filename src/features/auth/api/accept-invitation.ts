import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type User } from '@shared/schemas/auth';
import type { AcceptInvitationInput } from '@shared/schemas/team';
import { apiRequest } from '@/lib/api-client';
import { replaceSession } from '../utils/replace-session';

/** Creates the invited team account and signs it in. */
export async function acceptInvitation(input: AcceptInvitationInput): Promise<User> {
  const { user } = await apiRequest('/api/auth/invitations/accept', { method: 'POST', body: input, schema: userResponseSchema });
  return user;
}

export function useAcceptInvitation({ onSuccess }: { onSuccess?: (user: User) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: async (user) => {
      await replaceSession(queryClient, user);
      onSuccess?.(user);
    },
  });
}
