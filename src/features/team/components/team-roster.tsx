import { useState } from 'react';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { useTeam } from '../api/get-team';
import { useUpdateTeamMember } from '../api/update-team-member';
import { useWithdrawInvitation } from '../api/withdraw-invitation';
import { roleLabels } from '../utils/role-labels';
import { InvitationRow } from './invitation-row';
import { TeamInviteForm } from './team-invite-form';
import { TeamMemberRow } from './team-member-row';

/** The owner's Team page: who is on the team, their roles and access, and invitations still open. */
export function TeamRoster({ currentUserId }: { currentUserId: string }) {
  const teamQuery = useTeam();
  const updateMember = useUpdateTeamMember();
  const withdrawInvitation = useWithdrawInvitation();
  const [announcement, setAnnouncement] = useState('');

  let members;
  let invitations;
  if (teamQuery.data) {
    const team = teamQuery.data;
    members = (
      <ul aria-label="Team members" className="grid items-start gap-4 lg:grid-cols-2">
        {team.members.map((member) => (
          <TeamMemberRow
            key={member.id}
            member={member}
            isYou={member.id === currentUserId}
            onChangeRole={async (role) => {
              await updateMember.mutateAsync({ userId: member.id, update: { role } });
              setAnnouncement(`${member.name} is now ${roleLabels[role].toLowerCase()}.`);
            }}
            onSetDisabled={async (disabled) => {
              await updateMember.mutateAsync({ userId: member.id, update: { disabled } });
              setAnnouncement(disabled ? `${member.name} can no longer sign in.` : `${member.name} can sign in again.`);
            }}
          />
        ))}
      </ul>
    );
    invitations =
      team.invitations.length === 0 ? (
        <p className="text-ink-muted">No invitations are waiting for an answer.</p>
      ) : (
        <ul className="divide-y divide-rule rounded-card border border-rule bg-sheet">
          {team.invitations.map((invitation) => (
            <InvitationRow
              key={invitation.id}
              invitation={invitation}
              onWithdraw={async () => {
                await withdrawInvitation.mutateAsync(invitation.id);
                setAnnouncement(`The invitation to ${invitation.email} is withdrawn; its link no longer works.`);
              }}
            />
          ))}
        </ul>
      );
  } else if (teamQuery.isError) {
    members = <ErrorState title="The team could not load" error={teamQuery.error} onRetry={() => void teamQuery.refetch()} />;
  } else {
    members = (
      <div className="grid gap-4 lg:grid-cols-2">
        <p role="status" className="sr-only">
          Loading the team…
        </p>
        <Skeleton className="h-40 rounded-card" />
        <Skeleton className="h-40 rounded-card" />
      </div>
    );
  }

  return (
    <>
      <p role="status" className="mb-4 font-semibold text-ok empty:mb-0">
        {announcement}
      </p>
      <div className="grid gap-10">
        <section aria-labelledby="team-members">
          <h2 id="team-members" className="mb-4 text-h2">
            Members
          </h2>
          {members}
        </section>
        <section aria-labelledby="team-invite" className="max-w-xl">
          <h2 id="team-invite" className="mb-4 text-h2">
            Invite someone
          </h2>
          <div className="rounded-card border border-rule bg-sheet p-5 shadow-card">
            <TeamInviteForm onInvited={(invitation) => setAnnouncement(`Invitation sent to ${invitation.email}.`)} />
          </div>
        </section>
        {invitations ? (
          <section aria-labelledby="team-invitations">
            <h2 id="team-invitations" className="mb-4 text-h2">
              Open invitations
            </h2>
            {invitations}
          </section>
        ) : null}
      </div>
    </>
  );
}
