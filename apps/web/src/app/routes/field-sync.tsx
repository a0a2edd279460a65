import { can } from '@stringfield/shared';
import { lazy, Suspense } from 'react';
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
        <Suspense fallback={null}>
          <CheckQueueSync userId={user.id} />
        </Suspense>
      ) : null}
    </>
  );
}
