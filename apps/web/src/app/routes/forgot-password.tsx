import { Link } from 'react-router';
import { paths } from '@/config/paths';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { AuthShell } from '../layout/auth-shell';

export function ForgotPasswordRoute() {
  return (
    <AuthShell
      title="Forgot your password?"
      description="Enter your e-mail address and we will send you a link to choose a new one."
      footer={
        <Link to={paths.signIn()} className="inline-flex min-h-touch items-center font-semibold text-brand underline underline-offset-4 hover:text-brand-strong">
          Back to sign in
        </Link>
      }
    >
      <ForgotPasswordForm />
    </AuthShell>
  );
}
