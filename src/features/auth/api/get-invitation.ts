import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationPreviewSchema, type InvitationPreview } from '@shared/schemas/team';
import { apiRequest } from '@/lib/api-client';

/** What an invitation link offers. POST keeps the token out of URLs and logs; nothing changes on the server. */
export function getInvitation({ token, signal }: { token: string; signal?: AbortSignal }): Promise<InvitationPreview> {
  return apiRequest('/api/auth/invitations/preview', { method: 'POST', body: { token }, schema: invitationPreviewSchema, signal });
}

export function getInvitationQueryOptions(token: string) {
  return queryOptions({
    queryKey: ['auth', 'invitation', token],
    queryFn: ({ signal }) => getInvitation({ token, signal }),
    staleTime: Infinity,
  });
}

export function useInvitation(token: string) {
  return useQuery(getInvitationQueryOptions(token));
}
