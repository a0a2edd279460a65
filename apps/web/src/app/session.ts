import type { SessionUser } from '@stringfield/shared';
import { createContext, use } from 'react';

/** The signed-in person, provided by the protected layout to every page inside it. */
export const SessionUserContext = createContext<SessionUser | null>(null);

export function useSessionUser(): SessionUser {
  const user = use(SessionUserContext);
  if (!user) throw new Error('useSessionUser must be used inside the protected layout');
  return user;
}
