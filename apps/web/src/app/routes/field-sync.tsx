import { can } from '@stringfield/shared';
import { Component, lazy, Suspense, type ErrorInfo, type ReactNode } from 'react';
import { Outlet } from 'react-router';
import { useSessionUser } from '../session';

// Only people who record checks need it, so everyone else's start-up neither downloads nor runs it
// (the check queue and the field-check schemas); the service worker precaches it for offline starts.
const CheckQueueSync = lazy(async () => ({
  default: (await import('@/features/field-checks/components/check-queue-sync')).CheckQueueSync,
}));

/**
 * Wraps every signed-in page: for people who record checks, the queue on the phone is sent whenever
 * the connection allows, and a small indicator shows while readings wait.
 */
export function FieldSyncLayout() {
  const user = useSessionUser();
  return (
    <>
      <Outlet />
      {can(user.role, 'checks:record') ? (
        <SyncFailureBoundary>
          <Suspense fallback={null}>
            <CheckQueueSync userId={user.id} />
          </Suspense>
        </SyncFailureBoundary>
      ) : null}
    </>
  );
}

/**
 * The sync runs in the background: should its code fail to load (a file gone after a release, the
 * connection dropping while it downloads), the page stays usable and a small notice says that saved
 * checks wait for a reload (the queue itself is kept on the phone). React does not retry a failed
 * lazy import, so a reload is the way back.
 */
class SyncFailureBoundary extends Component<{ children: ReactNode }, { hasFailed: boolean }> {
  override state = { hasFailed: false };

  static getDerivedStateFromError(): { hasFailed: boolean } {
    return { hasFailed: true };
  }

  override componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error('The check queue sync did not load; queued checks are sent after a reload', error, info.componentStack);
  }

  override render() {
    if (!this.state.hasFailed) return this.props.children;
    return (
      <div
        role="status"
        className="fixed right-3 bottom-20 z-40 flex max-w-[calc(100vw-1.5rem)] items-center gap-1 rounded-card border border-attention/50 bg-attention-soft py-1 pr-1 pl-3 text-sm text-ink shadow-raised lg:right-6 lg:bottom-6"
      >
        <span className="py-1">Saved checks are not sent until the app reloads.</span>
        <button
          type="button"
          onClick={() => window.location.reload()}
          className="inline-flex min-h-touch shrink-0 items-center rounded-control px-3 font-semibold text-ink underline underline-offset-4 hover:bg-attention/10"
        >
          Reload
        </button>
      </div>
    );
  }
}
