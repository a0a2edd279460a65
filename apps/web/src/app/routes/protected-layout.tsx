import { Navigate, Outlet, useLocation } from 'react-router';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { AppShell } from '../layout/app-shell';
import { SessionUserContext } from '../session';
import { SessionError, SessionLoading } from './full-page-states';

/** Everything behind sign-in. Signed-out visitors go to sign-in with the page they asked for as `next`. */
export function ProtectedLayout() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) return <SessionLoading />;
  if (me.isError) return <SessionError error={me.error} onRetry={() => void me.refetch()} isRetrying={me.isFetching} />;
  if (!me.data) return <Navigate to={paths.signIn(`${location.pathname}${location.search}${location.hash}`)} replace />;

  return (
    <SessionUserContext value={me.data}>
      <AppShell user={me.data}>
        <Outlet />
      </AppShell>
    </SessionUserContext>
  );
}
