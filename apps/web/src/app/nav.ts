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
  /** Narrows the item to these roles on top of `action`, for pages written for one audience (an owner's reports). */
  roles?: readonly Role[];
  /** Only highlighted on an exact match (for the home page). */
  isExact?: boolean;
  /**
   * Place in the phone tab bar, lowest first: one number for every role, or one per role. Items
   * without one (for that role) go under "More" unless there is room for every item.
   */
  phonePriority?: number | Partial<Record<Role, number>>;
};

export const navItems: readonly NavItem[] = [
  { label: 'Today', to: paths.home(), pattern: routes.home, icon: 'today', isExact: true, phonePriority: 1 },
  { label: 'Work orders', to: paths.workOrders(), pattern: routes.workOrders, icon: 'clipboard', action: 'workOrders:read', phonePriority: 2 },
  { label: 'Sites', to: paths.sites(), pattern: routes.sites, icon: 'bolt', action: 'assets:read', phonePriority: { admin: 3, dispatcher: 3, supervisor: 3, owner: 3, technician: 4 } },
  { label: 'Fleet', to: paths.fleet(), pattern: routes.fleet, icon: 'shield', action: 'fleet:read', phonePriority: { owner: 2 } },
  { label: 'Datasheets', to: paths.datasheets(), pattern: routes.datasheets, icon: 'file', action: 'assets:read' },
  { label: 'Instruments', to: paths.instruments(), pattern: routes.instruments, icon: 'compass', action: 'instruments:manage', phonePriority: { technician: 3, dispatcher: 4 } },
  { label: 'People', to: paths.people(), pattern: routes.people, icon: 'people', action: 'users:manage', phonePriority: { admin: 4 } },
  { label: 'Outbox', to: paths.outbox(), pattern: routes.outbox, icon: 'mail', action: 'mail:read' },
  { label: 'Reports', to: paths.reports(), pattern: routes.reports, icon: 'file', action: 'workOrders:read', roles: ['owner'] },
  { label: 'Settings', to: paths.settings(), pattern: routes.settings, icon: 'settings' },
];

/** The items a role may see, in order. */
export function navItemsFor(role: Role | null | undefined, items: readonly NavItem[] = navItems): NavItem[] {
  return items.filter(
    (item) => (item.action === undefined || can(role, item.action)) && (item.roles === undefined || (role ? item.roles.includes(role) : false)),
  );
}

/** Tabs on a phone-width bar besides "More": fits 360 px with 15 px labels (see the app shell). */
export const PHONE_TAB_LIMIT = 3;
/** From 480 px one more tab fits. */
export const PHONE_TAB_LIMIT_WIDE = 4;

function phoneRank(item: NavItem, role: Role | null | undefined): number {
  const priority = item.phonePriority;
  if (typeof priority === 'number') return priority;
  const forRole = role ? priority?.[role] : undefined;
  return forRole ?? Number.MAX_SAFE_INTEGER;
}

/**
 * The phone tab bar for a role: up to `limit` tabs, highest priority first (ties and unranked items
 * in menu order), and the rest, in menu order, for the "More" sheet. When one slot would hold a
 * "More" with a single item, that item takes the slot instead. Visibility stays with `navItemsFor`.
 */
export function phoneTabsFor(
  role: Role | null | undefined,
  limit: number = PHONE_TAB_LIMIT,
  items: readonly NavItem[] = navItems,
): { tabs: NavItem[]; more: NavItem[] } {
  const visible = navItemsFor(role, items);
  const ranked = visible
    .map((item, index) => ({ item, index, rank: phoneRank(item, role) }))
    .sort((a, b) => a.rank - b.rank || a.index - b.index)
    .map(({ item }) => item);
  if (visible.length <= limit + 1) return { tabs: ranked, more: [] };
  const tabs = ranked.slice(0, limit);
  return { tabs, more: visible.filter((item) => !tabs.includes(item)) };
}

/** Whether an item is the page at `pathname`, the way NavLink decides it (whole path segments). */
export function isNavItemActive(item: NavItem, pathname: string): boolean {
  const path = pathname.length > 1 ? pathname.replace(/\/+$/, '') : pathname;
  if (path === item.to) return true;
  return !item.isExact && path.startsWith(item.to === '/' ? '/' : `${item.to}/`);
}

/** `/work-orders/:id/field`: a technician's field page. */
const fieldPagePath = /^\/work-orders\/[^/]+\/field\/?$/;

/**
 * Whether `item` is the current place for `role` at `pathname`: the path's own item, except that a
 * technician's field page belongs to "Today", where their work list led them (not to the board).
 */
export function isNavItemCurrent(item: NavItem, pathname: string, role: Role | null | undefined): boolean {
  if (role === 'technician' && fieldPagePath.test(pathname)) return item.to === paths.home();
  return isNavItemActive(item, pathname);
}
