import { useDeferredValue } from 'react';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { safeNext } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { AuthShell } from '../layout/auth-shell';
import { SessionLoading } from './full-page-states';

export function SignInRoute() {
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  // TanStack's updates render synchronously; through deferred values the form is drawn in a background
  // render that React does in short slices once the answer is in.
  const isPending = useDeferredValue(me.isPending);
  const user = useDeferredValue(me.data);
  const next = safeNext(searchParams.get('next'));
  const hasNext = next !== '/';

  if (isPending) return <SessionLoading />;
  if (user) return <Navigate to={next} replace />;

  return (
    <AuthShell title="Sign in" description="Use the e-mail address your administrator invited.">
      {hasNext ? (
        <Alert tone="info" className="mb-5">
          Sign in to open the page you asked for.
        </Alert>
      ) : null}
      <SignInForm onSignedIn={() => void navigate(next, { replace: true })} />
    </AuthShell>
  );
}
