import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AuthPanel } from '@/features/auth/components/auth-panel';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  return (
    <AuthPanel
      title="Forgot your password?"
      lead="Enter the e-mail address of your account and we will send a link to choose a new password."
      footer={
        <Link to={paths.signIn.getHref()} className="font-semibold text-leaf underline">
          Back to sign in
        </Link>
      }
    >
      <ForgotPasswordForm />
    </AuthPanel>
  );
}
