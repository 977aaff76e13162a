import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { RequireRole } from '@/features/auth/components/require-role';
import { requireUser } from '@/features/auth/utils/require-user';
import { ownerRoles } from '@/features/auth/utils/roles';
import { getTeamQueryOptions } from '@/features/team/api/get-team';
import { TeamRoster } from '@/features/team/components/team-roster';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Only the owner's browser asks for the team; anyone else is shown why the page is closed.
    const user = await requireUser(queryClient, request);
    if (ownerRoles.includes(user.role)) void queryClient.prefetchQuery(getTeamQueryOptions());
    return null;
  };

function OwnersTeam() {
  const user = useCurrentUser().data;
  if (!user) return null;
  return <TeamRoster currentUserId={user.id} />;
}

export default function TeamRoute() {
  return (
    <RequireRole
      allowed={ownerRoles}
      notAllowed={{ title: 'Team is for the owner', reason: 'Only the shop’s owner invites people, changes roles and turns access off.' }}
    >
      <PageTitle title="Team · Roastery" />
      <PageHeader
        eyebrow="Roastery"
        title="Team"
        lead="Who can open the Roastery, and in which role. Changes take effect on the person’s next click; turning access off also signs them out everywhere."
      />
      <OwnersTeam />
    </RequireRole>
  );
}
