import { permissions, roles, type Role } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { isNavItemActive, isNavItemCurrent, navItems, navItemsFor, PHONE_TAB_LIMIT, PHONE_TAB_LIMIT_WIDE, phoneTabsFor, type NavItem } from './nav';

const labels = (items: readonly NavItem[]) => items.map((item) => item.label);

/**
 * What each role sees of the items this file knows about, stated by hand from the permission table.
 * Items added later (Fleet, Reports …) are checked by the rule below, not by these lists.
 */
const known = ['Today', 'Work orders', 'Sites', 'Datasheets', 'Instruments', 'People', 'Outbox', 'Settings'];
const expected: Record<Role, string[]> = {
  admin: ['Today', 'Work orders', 'Sites', 'Datasheets', 'Instruments', 'People', 'Outbox', 'Settings'],
  dispatcher: ['Today', 'Work orders', 'Sites', 'Datasheets', 'Instruments', 'Settings'],
  technician: ['Today', 'Work orders', 'Sites', 'Datasheets', 'Instruments', 'Settings'],
  supervisor: ['Today', 'Work orders', 'Sites', 'Datasheets', 'Settings'],
  owner: ['Today', 'Work orders', 'Sites', 'Datasheets', 'Settings'],
};

describe('navItemsFor', () => {
  it.each(roles)('gives a %s exactly the known items it may use, in order', (role) => {
    expect(labels(navItemsFor(role)).filter((label) => known.includes(label))).toEqual(expected[role]);
  });

  it.each(roles)('shows a %s every item, and only the items, the permission table allows', (role) => {
    const allowed = (item: NavItem) =>
      (item.action === undefined || (permissions[item.action] as readonly Role[]).includes(role)) && (item.roles === undefined || item.roles.includes(role));
    expect(labels(navItemsFor(role))).toEqual(labels(navItems.filter(allowed)));
  });

  it('keeps the administration pages from everyone but administrators, and instruments from readers', () => {
    for (const role of roles.filter((r) => r !== 'admin')) expect(labels(navItemsFor(role))).not.toContain('People');
    for (const role of roles.filter((r) => r !== 'admin')) expect(labels(navItemsFor(role))).not.toContain('Outbox');
    expect(labels(navItemsFor('supervisor'))).not.toContain('Instruments');
    expect(labels(navItemsFor('owner'))).not.toContain('Instruments');
  });

  it('gives a signed-out visitor only what needs no permission', () => {
    expect(labels(navItemsFor(null))).toEqual(labels(navItems.filter((item) => item.action === undefined && item.roles === undefined)));
    expect(labels(navItemsFor(null))).toEqual(expect.arrayContaining(['Today', 'Settings']));
  });
});

describe('phoneTabsFor', () => {
  it.each([
    ['technician', ['Today', 'Work orders', 'Instruments']],
    ['dispatcher', ['Today', 'Work orders', 'Sites']],
    ['admin', ['Today', 'Work orders', 'Sites']],
  ] as const)('puts a %s on %j first', (role, tabs) => {
    expect(labels(phoneTabsFor(role).tabs)).toEqual(tabs);
  });

  it('starts every role on Today and Work orders, and gives an owner Sites where four fit', () => {
    for (const role of roles) expect(labels(phoneTabsFor(role).tabs).slice(0, 2)).toEqual(['Today', 'Work orders']);
    expect(labels(phoneTabsFor('owner', PHONE_TAB_LIMIT_WIDE).tabs)).toContain('Sites');
  });

  it('adds the next tab by priority where four fit', () => {
    expect(labels(phoneTabsFor('technician', PHONE_TAB_LIMIT_WIDE).tabs)).toEqual(['Today', 'Work orders', 'Instruments', 'Sites']);
    expect(labels(phoneTabsFor('dispatcher', PHONE_TAB_LIMIT_WIDE).tabs)).toEqual(['Today', 'Work orders', 'Sites', 'Instruments']);
    expect(labels(phoneTabsFor('admin', PHONE_TAB_LIMIT_WIDE).tabs)).toEqual(['Today', 'Work orders', 'Sites', 'People']);
  });

  it('lists the rest under More in menu order', () => {
    expect(labels(phoneTabsFor('technician').more)).toEqual(
      labels(navItemsFor('technician')).filter((label) => !['Today', 'Work orders', 'Instruments'].includes(label)),
    );
    expect(labels(phoneTabsFor('admin').more).filter((label) => known.includes(label))).toEqual(['Datasheets', 'Instruments', 'People', 'Outbox', 'Settings']);
  });

  it.each(roles.flatMap((role) => [PHONE_TAB_LIMIT, PHONE_TAB_LIMIT_WIDE].map((limit) => [role, limit] as const)))(
    'splits what a %s may see (limit %i) into tabs and More, each item once, nothing else',
    (role, limit) => {
      const { tabs, more } = phoneTabsFor(role, limit);
      const visible = navItemsFor(role);
      expect(tabs.length).toBeLessThanOrEqual(more.length > 0 ? limit : limit + 1);
      expect([...tabs, ...more]).toHaveLength(visible.length);
      expect(new Set([...tabs, ...more])).toEqual(new Set(visible));
      // The narrow bar's tabs are a prefix of the wide one's, so the shell can hide the extra tab by CSS.
      if (limit === PHONE_TAB_LIMIT_WIDE) expect(tabs.slice(0, phoneTabsFor(role).tabs.length)).toEqual(phoneTabsFor(role).tabs);
    },
  );

  it('never offers an item the role may not see', () => {
    const { tabs, more } = phoneTabsFor('technician', PHONE_TAB_LIMIT);
    expect(labels([...tabs, ...more])).not.toContain('People');
    expect(labels([...tabs, ...more])).not.toContain('Outbox');
  });

  it('uses the More slot for the last item rather than a More holding one item', () => {
    const items: NavItem[] = ['A', 'B', 'C', 'D'].map((label) => ({ label, to: `/${label}`, pattern: `/${label}`, icon: 'file' }));
    expect(phoneTabsFor('owner', 3, items)).toEqual({ tabs: items, more: [] });
    const five = [...items, { label: 'E', to: '/E', pattern: '/E', icon: 'file' } satisfies NavItem];
    expect(labels(phoneTabsFor('owner', 3, five).tabs)).toEqual(['A', 'B', 'C']);
    expect(labels(phoneTabsFor('owner', 3, five).more)).toEqual(['D', 'E']);
  });

  it('ranks by the role’s own priority, then menu order', () => {
    const items: NavItem[] = [
      { label: 'A', to: '/a', pattern: '/a', icon: 'file' },
      { label: 'B', to: '/b', pattern: '/b', icon: 'file', phonePriority: { owner: 1 } },
      { label: 'C', to: '/c', pattern: '/c', icon: 'file', phonePriority: 2 },
      { label: 'D', to: '/d', pattern: '/d', icon: 'file' },
      { label: 'E', to: '/e', pattern: '/e', icon: 'file' },
    ];
    expect(labels(phoneTabsFor('owner', 3, items).tabs)).toEqual(['B', 'C', 'A']);
    expect(labels(phoneTabsFor('admin', 3, items).tabs)).toEqual(['C', 'A', 'B']);
  });
});

describe('isNavItemActive', () => {
  const item = (to: string, isExact?: boolean): NavItem => ({ label: to, to, pattern: to, icon: 'file', ...(isExact ? { isExact } : {}) });

  it('matches whole path segments', () => {
    expect(isNavItemActive(item('/people'), '/people')).toBe(true);
    expect(isNavItemActive(item('/people'), '/people/')).toBe(true);
    expect(isNavItemActive(item('/people'), '/people/12')).toBe(true);
    expect(isNavItemActive(item('/people'), '/peoplex')).toBe(false);
  });

  it('matches the home page only exactly', () => {
    expect(isNavItemActive(item('/', true), '/')).toBe(true);
    expect(isNavItemActive(item('/', true), '/people')).toBe(false);
  });
});

describe('isNavItemCurrent', () => {
  const today = navItems.find((i) => i.label === 'Today')!;
  const board = navItems.find((i) => i.label === 'Work orders')!;

  it('puts a technician’s field page under Today, not under the board', () => {
    expect(isNavItemCurrent(today, '/work-orders/12/field', 'technician')).toBe(true);
    expect(isNavItemCurrent(board, '/work-orders/12/field', 'technician')).toBe(false);
  });

  it('keeps the field page under Work orders for the desk roles, and the ticket page for everyone', () => {
    expect(isNavItemCurrent(board, '/work-orders/12/field', 'dispatcher')).toBe(true);
    expect(isNavItemCurrent(today, '/work-orders/12/field', 'dispatcher')).toBe(false);
    expect(isNavItemCurrent(board, '/work-orders/12', 'technician')).toBe(true);
  });
});
