import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AuthPanel } from '@/features/auth/components/auth-panel';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { safeRedirectTo } from '@/features/auth/utils/redirect-to';
import { redirectIfSignedIn } from '@/features/auth/utils/require-user';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    redirectIfSignedIn(queryClient, request);

export default function CreateAccountRoute() {
  const [search] = useSearchParams();
  const navigate = useNavigate();

  return (
    <AuthPanel
      title="Create your account"
      lead="One account for green coffee orders, Roasted to Order subscriptions and your Roast Journal."
      footer={
        <p>
          Already have an account?{' '}
          <Link to={paths.signIn.getHref(search.get('redirectTo') ?? undefined)} className="font-semibold text-leaf underline">
            Sign in instead
          </Link>
        </p>
      }
    >
      <SignUpForm onSignedUp={() => void navigate(safeRedirectTo(search), { replace: true })} />
    </AuthPanel>
  );
}
