import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import type { Role } from '@shared/domain/vocabulary';
import { ErrorState } from '@/components/ui/error-state';
import { useRoleAccess } from '../hooks/use-role-access';
import { signInHrefFor } from '../utils/redirect-to';
import { NotAllowed } from './not-allowed';

type RequireRoleProps = {
  allowed: readonly Role[];
  /** What a signed-in person without the role sees: a title and a sentence on who the page is for. */
  notAllowed?: { title: string; reason: ReactNode };
  children: ReactNode;
};

const closed = { title: 'This page is not open to your account', reason: 'It belongs to another part of the shop.' };

/**
 * Shows `children` only to the roles the server would serve; a visitor goes to sign-in (and comes
 * back), anyone else sees why the page is closed to them. It hides, the server forbids.
 */
export function RequireRole({ allowed, notAllowed = closed, children }: RequireRoleProps) {
  const { access, error, retry } = useRoleAccess(allowed);
  const location = useLocation();

  switch (access) {
    case 'allowed':
      return children;
    case 'signed-out':
      return <Navigate to={signInHrefFor(location)} replace />;
    case 'not-allowed':
      return <NotAllowed title={notAllowed.title}>{notAllowed.reason}</NotAllowed>;
    case 'failed':
      return <ErrorState title="Restday could not check who is signed in" error={error} onRetry={retry} />;
    case 'checking':
      return (
        <p role="status" className="text-ink-muted">
          Checking who is signed in…
        </p>
      );
  }
}
