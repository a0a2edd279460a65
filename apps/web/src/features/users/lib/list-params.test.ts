import { describe, expect, it } from 'vitest';
import { defaultUsersListParams, parseUsersListParams, sortingFromParam, sortParamFromSorting, usersListSearch } from './list-params';

describe('parseUsersListParams', () => {
  it('reads a shared link back into the same list', () => {
    const params = parseUsersListParams(new URLSearchParams('q=ana&role=technician&status=inactive&sort=-createdAt&page=3&pageSize=50'));
    expect(params).toEqual({ q: 'ana', role: 'technician', status: 'inactive', sort: '-createdAt', page: 3, pageSize: 50 });
  });

  it('falls back field by field when a hand-edited link has nonsense in it', () => {
    const params = parseUsersListParams(new URLSearchParams('role=electrician&status=maybe&sort=salary&page=-2&pageSize=9999&q=ok'));
    expect(params).toEqual({ ...defaultUsersListParams, q: 'ok' });
  });

  it('round-trips through the URL, leaving defaults out', () => {
    const params = { ...defaultUsersListParams, role: 'owner' as const, page: 2 };
    expect(usersListSearch(params)).toEqual({ q: undefined, role: 'owner', status: undefined, sort: undefined, page: 2, pageSize: undefined });
    expect(usersListSearch(defaultUsersListParams)).toEqual({
      q: undefined,
      role: undefined,
      status: undefined,
      sort: undefined,
      page: undefined,
      pageSize: undefined,
    });
  });
});

describe('sorting', () => {
  it('turns a leading minus into a descending column and back', () => {
    expect(sortingFromParam('-email')).toEqual([{ id: 'email', desc: true }]);
    expect(sortParamFromSorting([{ id: 'email', desc: true }])).toBe('-email');
    expect(sortParamFromSorting([{ id: 'role', desc: false }])).toBe('role');
  });

  it('sorts by name when asked to sort by a column the API cannot sort', () => {
    expect(sortParamFromSorting([{ id: 'lastSignInAt', desc: true }])).toBe('name');
    expect(sortParamFromSorting([])).toBe('name');
  });
});
