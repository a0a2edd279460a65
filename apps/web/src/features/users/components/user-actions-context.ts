import { createContext, use } from 'react';
import type { User } from '@stringfield/shared';

/* Table columns live at module scope, so the row's "Manage" button reaches the page through context. */
export type UserActions = { currentUserId: number | undefined; onManage: (user: User) => void };

export const UserActionsContext = createContext<UserActions>({ currentUserId: undefined, onManage: () => undefined });

export function useUserActions(): UserActions {
  return use(UserActionsContext);
}
