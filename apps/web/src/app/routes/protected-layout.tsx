import { onlineManager } from '@tanstack/react-query';
import { useDeferredValue, useSyncExternalStore } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router';
import { Icon } from '@/components/ui/icon';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { AppShell } from '../layout/app-shell';
import { SessionUserContext } from '../session';
import { SessionError, SessionLoading } from './full-page-states';
import { sessionView } from './session-view';

const subscribeOnline = (onChange: () => void) => onlineManager.subscribe(onChange);

/** Whether TanStack Query believes there is a connection (it pauses queries while there is none). */
function useIsOnline(): boolean {
  return useSyncExternalStore(subscribeOnline, () => onlineManager.isOnline(), () => true);
}

/**
 * Everything behind sign-in. Signed-out visitors go to sign-in with the page they asked for as `next`.
 * Without a connection the session kept on the device carries the app, with a notice; the error page
 * is only for when there is none.
 */
export function ProtectedLayout() {
  const me = useMe();
  const isOnline = useIsOnline();
  const location = useLocation();
  // The answer about the session decides whether the whole app (frame and page) is drawn. TanStack's
  // updates render synchronously; through deferred values that first drawing is a background render
  // that React does in short slices, so the main thread stays free for input while it mounts.
  const deferred = {
    status: useDeferredValue(me.status),
    fetchStatus: useDeferredValue(me.fetchStatus),
    data: useDeferredValue(me.data),
    error: useDeferredValue(me.error),
  };
  const deferredIsOnline = useDeferredValue(isOnline);
  // Never deferred once the person is gone (signed out, the session ended elsewhere) or another one
  // is: the deferred copy would draw the last person's frame and page once more.
  const isPersonGone = !me.data || (deferred.data != null && deferred.data.id !== me.data.id);
  const view = isPersonGone
    ? sessionView({ status: me.status, fetchStatus: me.fetchStatus, data: me.data, error: me.error }, isOnline)
    : sessionView(deferred, deferredIsOnline);

  if (view.kind === 'loading') return <SessionLoading />;
  if (view.kind === 'error') return <SessionError error={view.error} onRetry={() => void me.refetch()} isRetrying={me.isFetching} />;
  if (view.kind === 'signed-out') {
    // The loading frame, not a blank page, while the sign-in page's code loads.
    return (
      <>
        <SessionLoading />
        <Navigate to={paths.signIn(`${location.pathname}${location.search}${location.hash}`)} replace />
      </>
    );
  }

  const notice = view.isSaved ? <OfflineNotice onRetry={() => void me.refetch()} isRetrying={me.isFetching} /> : null;

  return (
    <SessionUserContext value={view.user}>
      <AppShell user={view.user} notice={notice}>
        <Outlet />
      </AppShell>
    </SessionUserContext>
  );
}

function OfflineNotice({ onRetry, isRetrying }: { onRetry: () => void; isRetrying: boolean }) {
  return (
    <div role="status" className="flex items-center gap-1.5 rounded-control border border-attention/50 bg-attention-soft pl-2.5 text-xs text-ink">
      <Icon name="alert" className="size-5 text-attention" />
      <p className="min-w-0 flex-1 py-1">
        <span className="font-semibold">Offline</span> — showing saved data
      </p>
      <button
        type="button"
        onClick={onRetry}
        disabled={isRetrying}
        className="inline-flex min-h-touch shrink-0 items-center gap-1.5 rounded-control px-2.5 font-semibold text-ink hover:bg-attention/10 disabled:opacity-60"
      >
        <Icon name="refresh" className={isRetrying ? 'animate-spin' : undefined} />
        {isRetrying ? 'Checking…' : 'Retry'}
      </button>
    </div>
  );
}
