import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pendingInvitationSchema, type PendingInvitation, type TeamInvitationInput } from '@shared/schemas/team';
import { apiRequest } from '@/lib/api-client';
import { getTeamQueryOptions } from './get-team';

/** Sends an invitation link by e-mail. */
export function inviteTeamMember(input: TeamInvitationInput): Promise<PendingInvitation> {
  return apiRequest('/api/owner/team', { method: 'POST', body: input, schema: pendingInvitationSchema });
}

export function useInviteTeamMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteTeamMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTeamQueryOptions().queryKey }),
  });
}
