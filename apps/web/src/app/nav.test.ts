import { roles } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { navItemsFor } from './nav';

describe('navItemsFor', () => {
  it('gives an administrator Today, Work orders, Sites, Datasheets, People, the Outbox and Settings, in that order', () => {
    expect(navItemsFor('admin').map((item) => item.label)).toEqual(['Today', 'Work orders', 'Sites', 'Datasheets', 'People', 'Outbox', 'Settings']);
  });

  it.each(roles.filter((role) => role !== 'admin'))('gives a %s Today, Work orders, Sites, Datasheets and Settings', (role) => {
    expect(navItemsFor(role).map((item) => item.label)).toEqual(['Today', 'Work orders', 'Sites', 'Datasheets', 'Settings']);
  });

  it('gives a signed-out visitor only what needs no permission', () => {
    expect(navItemsFor(null).map((item) => item.label)).toEqual(['Today', 'Settings']);
  });
});
