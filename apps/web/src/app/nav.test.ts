import { roles } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { navItemsFor } from './nav';

describe('navItemsFor', () => {
  it('gives an administrator Today, People and the Outbox, in that order', () => {
    expect(navItemsFor('admin').map((item) => item.label)).toEqual(['Today', 'People', 'Outbox']);
  });

  it.each(roles.filter((role) => role !== 'admin'))('gives a %s only Today for now', (role) => {
    expect(navItemsFor(role).map((item) => item.label)).toEqual(['Today']);
  });

  it('gives a signed-out visitor only what needs no permission', () => {
    expect(navItemsFor(null).map((item) => item.label)).toEqual(['Today']);
  });
});
