import { can } from '@stringfield/shared';
import { Outlet } from 'react-router';
import { CheckQueueSync } from '@/features/field-checks/components/check-queue-sync';
import { useSessionUser } from '../session';

/**
 * Wraps every signed-in page: for people who record checks, the queue on the phone is sent whenever
 * the connection allows, and a small indicator shows while readings wait.
 */
export function FieldSyncLayout() {
  const user = useSessionUser();
  return (
    <>
      <Outlet />
      {can(user.role, 'checks:record') ? <CheckQueueSync userId={user.id} /> : null}
    </>
  );
}
