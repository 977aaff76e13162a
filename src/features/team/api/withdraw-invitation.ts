import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { getTeamQueryOptions } from './get-team';

/** Withdraws an invitation nobody has accepted yet; its link stops working. */
export async function withdrawInvitation(invitationId: string): Promise<void> {
  await apiRequest(`/api/owner/team/invitations/${encodeURIComponent(invitationId)}`, { method: 'DELETE', schema: z.undefined() });
}

export function useWithdrawInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTeamQueryOptions().queryKey }),
  });
}
