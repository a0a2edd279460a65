import { can, type Action, type Role } from '@stringfield/shared';
import type { IconName } from '@/components/ui/icon';
import { paths, routes } from '../config/paths';

/**
 * The navigation as data. Each item names the permission it needs from the shared role × action
 * table, so the menu, the route guards and the API's requireRole read the same rule. Features add
 * their item here; order is the order on screen.
 */
export type NavItem = {
  label: string;
  to: string;
  /** The route pattern this item leads to, for the guard. */
  pattern: string;
  icon: IconName;
  /** Needed permission; absent means every signed-in role. */
  action?: Action;
  /** Only highlighted on an exact match (for the home page). */
  isExact?: boolean;
};

export const navItems: readonly NavItem[] = [
  { label: 'Today', to: paths.home(), pattern: routes.home, icon: 'today', isExact: true },
  { label: 'Work orders', to: paths.workOrders(), pattern: routes.workOrders, icon: 'clipboard', action: 'workOrders:read' },
  { label: 'Sites', to: paths.sites(), pattern: routes.sites, icon: 'bolt', action: 'assets:read' },
  { label: 'Datasheets', to: paths.datasheets(), pattern: routes.datasheets, icon: 'file', action: 'assets:read' },
  { label: 'Instruments', to: paths.instruments(), pattern: routes.instruments, icon: 'compass', action: 'instruments:manage' },
  { label: 'People', to: paths.people(), pattern: routes.people, icon: 'people', action: 'users:manage' },
  { label: 'Outbox', to: paths.outbox(), pattern: routes.outbox, icon: 'mail', action: 'mail:read' },
  { label: 'Settings', to: paths.settings(), pattern: routes.settings, icon: 'settings' },
];

/** The items a role may see, in order. */
export function navItemsFor(role: Role | null | undefined, items: readonly NavItem[] = navItems): NavItem[] {
  return items.filter((item) => item.action === undefined || can(role, item.action));
}
