import { can, type Action } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { useSessionUser } from '../session';
import { NotAllowed } from './not-allowed';

/** Shows the page only to roles the shared permission table allows; others get a plain explanation. */
export function RequirePermission({ action, pageName, children }: { action: Action; pageName: string; children: ReactNode }) {
  const user = useSessionUser();
  if (!can(user.role, action)) return <NotAllowed pageName={pageName} action={action} role={user.role} />;
  return <>{children}</>;
}
