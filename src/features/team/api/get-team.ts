import { queryOptions, useQuery } from '@tanstack/react-query';
import { teamResponseSchema, type TeamResponse } from '@shared/schemas/team';
import { apiRequest } from '@/lib/api-client';

/** The shop's staff and owner accounts, disabled ones too, and the invitations still open. */
export function getTeam({ signal }: { signal?: AbortSignal } = {}): Promise<TeamResponse> {
  return apiRequest('/api/owner/team', { schema: teamResponseSchema, signal });
}

export function getTeamQueryOptions() {
  return queryOptions({
    queryKey: ['team'],
    queryFn: ({ signal }) => getTeam({ signal }),
  });
}

export function useTeam() {
  return useQuery(getTeamQueryOptions());
}
