import { resetInputSchema } from '@stringfield/shared';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { AuthShell } from '../layout/auth-shell';

const linkClasses = 'inline-flex min-h-touch items-center font-semibold text-brand underline underline-offset-4 hover:text-brand-strong';

/** `/reset-password?token=…` sets a new password; with `&invite=1` the same page accepts an invitation. */
export function ResetPasswordRoute() {
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const token = searchParams.get('token') ?? '';
  const isInvite = searchParams.get('invite') === '1';
  const isTokenWellFormed = resetInputSchema.shape.token.safeParse(token).success;

  const title = isInvite ? 'Welcome to Stringfield' : 'Choose a new password';
  const description = isInvite
    ? 'You have been invited to join your crew on Stringfield. Choose a password to finish setting up your account.'
    : 'Choose a new password for your Stringfield account.';

  const requestNewLink = (
    <Link to={paths.forgotPassword()} className={linkClasses}>
      Request a new link
    </Link>
  );

  if (!isTokenWellFormed) {
    return (
      <AuthShell title={title}>
        <Alert tone="fail" title="This link is incomplete">
          <p>The address is missing part of its code. Open the link straight from the e-mail, or copy the whole address.</p>
          <div className="mt-2">{requestNewLink}</div>
        </Alert>
        <div className="mt-5">
          <ButtonLink to={paths.signIn()} variant="secondary" isFullWidth>
            Go to sign in
          </ButtonLink>
        </div>
      </AuthShell>
    );
  }

  return (
    <AuthShell
      title={title}
      description={description}
      footer={
        <Link to={paths.signIn()} className={linkClasses}>
          Back to sign in
        </Link>
      }
    >
      <ResetPasswordForm
        token={token}
        isInvite={isInvite}
        requestNewLink={requestNewLink}
        onDone={() => {
          toast.success(isInvite ? 'Your account is ready' : 'Password saved', { description: 'Sign in with your e-mail and new password.' });
          void navigate(paths.signIn(), { replace: true });
        }}
      />
    </AuthShell>
  );
}
