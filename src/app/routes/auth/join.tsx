import { Link, useLocation, useNavigate } from 'react-router-dom';
import { linkTokenSchema, tokenFromFragment } from '@shared/schemas/auth';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useInvitation } from '@/features/auth/api/get-invitation';
import { AcceptInvitationForm } from '@/features/auth/components/accept-invitation-form';
import { AuthPanel } from '@/features/auth/components/auth-panel';
import { ApiError } from '@/lib/api-client';

const roleWords = { packer: 'a packer', staff: 'a member of staff', owner: 'an owner' } as const;

function UnusableLink({ title, children }: { title: string; children: string }) {
  return (
    <AuthPanel title={title}>
      <p>{children}</p>
      <p className="mt-4">
        <Link to={paths.home.getHref()} className="font-semibold text-leaf underline">
          Go to the shop
        </Link>
      </p>
    </AuthPanel>
  );
}

function Invitation({ token }: { token: string }) {
  const navigate = useNavigate();
  const invitationQuery = useInvitation(token);

  if (invitationQuery.data) {
    const invitation = invitationQuery.data;
    return (
      <AuthPanel title="Join the Roastery team" lead={`You are invited as ${roleWords[invitation.role]}. Choose your name and a password to accept.`}>
        <AcceptInvitationForm token={token} invitation={invitation} onJoined={() => void navigate(paths.roastery.overview.getHref(), { replace: true })} />
      </AuthPanel>
    );
  }
  if (invitationQuery.error instanceof ApiError && invitationQuery.error.status === 404) {
    return (
      <UnusableLink title="This invitation cannot be used">
        It has expired, was already accepted, or was withdrawn. Ask the shop’s owner to send a new one.
      </UnusableLink>
    );
  }
  if (invitationQuery.isError) {
    return <ErrorState title="The invitation could not load" error={invitationQuery.error} onRetry={() => void invitationQuery.refetch()} />;
  }
  return (
    <div className="mx-auto max-w-md">
      <p role="status" className="sr-only">
        Loading the invitation…
      </p>
      <Skeleton className="h-96 rounded-card" />
    </div>
  );
}

export default function JoinRoute() {
  const token = tokenFromFragment(useLocation().hash);
  if (!token || !linkTokenSchema.safeParse(token).success) {
    return (
      <UnusableLink title="This link is not complete">
        The invitation link is missing part of its address. Open it straight from the e-mail, or copy the whole link into the address bar.
      </UnusableLink>
    );
  }
  return <Invitation token={token} />;
}
