import { roles } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { navItemsFor } from './nav';

describe('Reports in the navigation', () => {
  it('is offered to asset owners, who download close-out reports', () => {
    expect(navItemsFor('owner').map((i) => i.label)).toContain('Reports');
  });

  it.each(roles.filter((r) => r !== 'owner'))('is not in the menu of a %s, who reads reports on the ticket', (role) => {
    expect(navItemsFor(role).map((i) => i.label)).not.toContain('Reports');
  });

  it('is not offered to a signed-out visitor', () => {
    expect(navItemsFor(null).map((i) => i.label)).not.toContain('Reports');
  });
});
