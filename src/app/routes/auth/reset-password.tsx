import { Link, useLocation, useNavigate } from 'react-router-dom';
import { linkTokenSchema, tokenFromFragment } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { AuthPanel } from '@/features/auth/components/auth-panel';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import type { SignInState } from './sign-in';

export default function ResetPasswordRoute() {
  const location = useLocation();
  const navigate = useNavigate();
  const token = tokenFromFragment(location.hash);

  if (!token || !linkTokenSchema.safeParse(token).success) {
    return (
      <AuthPanel title="This link is not complete">
        <p>The link to choose a new password is missing part of its address. Open it straight from the e-mail, or copy the whole link into the address bar.</p>
        <p className="mt-4">
          <Link to={paths.forgotPassword.getHref()} className="font-semibold text-leaf underline">
            Ask for a new link
          </Link>
        </p>
      </AuthPanel>
    );
  }

  const signInState: SignInState = { passwordReset: true };
  return (
    <AuthPanel title="Choose a new password" lead="Once it is saved, every browser signed in to your account is signed out.">
      <ResetPasswordForm token={token} onReset={() => void navigate(paths.signIn.getHref(), { replace: true, state: signInState })} />
    </AuthPanel>
  );
}
