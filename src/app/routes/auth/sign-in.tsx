import type { QueryClient } from '@tanstack/react-query';
import { Link, useLocation, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { FormAlert } from '@/components/ui/form-alert';
import { paths } from '@/config/paths';
import { AuthPanel } from '@/features/auth/components/auth-panel';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeRedirectTo } from '@/features/auth/utils/redirect-to';
import { redirectIfSignedIn } from '@/features/auth/utils/require-user';
import { roasteryRoles } from '@/features/auth/utils/roles';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    redirectIfSignedIn(queryClient, request);

/** Set by the reset-password page when it sends the person here. */
export type SignInState = { passwordReset?: boolean } | null;

export default function SignInRoute() {
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const state = useLocation().state as SignInState;
  const returnTo = search.get('redirectTo') ?? undefined;

  return (
    <AuthPanel
      title="Sign in"
      lead="Your orders, Deliveries and Roast Journal are on the other side."
      footer={
        <p>
          New here?{' '}
          <Link to={paths.createAccount.getHref(returnTo)} className="font-semibold text-leaf underline">
            Create an account
          </Link>
        </p>
      }
    >
      {state?.passwordReset ? (
        <div className="mb-5">
          <FormAlert tone="status">Your password is changed. Sign in with the new one.</FormAlert>
        </div>
      ) : null}
      <SignInForm
        onSignedIn={(user) => {
          // The team starts in the Roastery unless they were on their way somewhere else.
          const fallback = roasteryRoles.includes(user.role) ? paths.roastery.overview.getHref() : paths.account.overview.getHref();
          void navigate(safeRedirectTo(search, fallback), { replace: true });
        }}
      />
    </AuthPanel>
  );
}
