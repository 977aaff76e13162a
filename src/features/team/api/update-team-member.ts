import { useMutation, useQueryClient } from '@tanstack/react-query';
import { teamMemberSchema, type TeamMember, type TeamMemberUpdate } from '@shared/schemas/team';
import { apiRequest } from '@/lib/api-client';
import { getTeamQueryOptions } from './get-team';

/** Changes a member's role or access; it takes effect on their next request. */
export function updateTeamMember({ userId, update }: { userId: string; update: TeamMemberUpdate }): Promise<TeamMember> {
  return apiRequest(`/api/owner/team/${encodeURIComponent(userId)}`, { method: 'PATCH', body: update, schema: teamMemberSchema });
}

export function useUpdateTeamMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateTeamMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTeamQueryOptions().queryKey }),
  });
}
