import { describe, expect, it } from 'vitest';
import {
  defaultStringsListParams,
  parseLibraryListParams,
  parseSitesListParams,
  parseStringsListParams,
  sitesListSearch,
  sortingFromParam,
  sortParamFromSorting,
  stringSorts,
  stringsListSearch,
} from './list-params';

describe('parseStringsListParams', () => {
  it('reads the OSR failure view from a shared link', () => {
    const params = parseStringsListParams(new URLSearchParams('sizing=fail&inverterId=33&mpptInput=2&sort=-label&page=2&q=INV08'));
    expect(params).toEqual({ q: 'INV08', inverterId: 33, mpptInput: 2, sizing: 'fail', sort: '-label', page: 2, pageSize: 50 });
  });

  it('falls back value by value when a link was hand-edited', () => {
    const params = parseStringsListParams(new URLSearchParams('sizing=broken&inverterId=-4&page=zero&sort=voltage'));
    expect(params).toEqual(defaultStringsListParams);
  });

  it('leaves defaults out of the URL so links stay short', () => {
    expect(stringsListSearch({ ...defaultStringsListParams, sizing: 'fail' })).toEqual({
      q: undefined,
      inverterId: undefined,
      mpptInput: undefined,
      sizing: 'fail',
      sort: undefined,
      page: undefined,
      pageSize: undefined,
    });
  });
});

describe('parseSitesListParams', () => {
  it('keeps a known sort and drops an unknown one', () => {
    expect(parseSitesListParams(new URLSearchParams('sort=-code')).sort).toBe('-code');
    expect(parseSitesListParams(new URLSearchParams('sort=owner')).sort).toBe('name');
  });

  it('round-trips a search through the URL', () => {
    const params = parseSitesListParams(new URLSearchParams('q=ridge&page=3'));
    expect(sitesListSearch(params)).toEqual({ q: 'ridge', sort: undefined, page: 3, pageSize: undefined });
  });
});

describe('parseLibraryListParams', () => {
  it('shows archived datasheets only when asked', () => {
    expect(parseLibraryListParams(new URLSearchParams('archived=true')).includeArchived).toBe(true);
    expect(parseLibraryListParams(new URLSearchParams('archived=yes')).includeArchived).toBe(false);
  });
});

describe('sorting', () => {
  it('turns -modulesInSeries into a descending column sort and back', () => {
    const sorting = sortingFromParam('-modulesInSeries');
    expect(sorting).toEqual([{ id: 'modulesInSeries', desc: true }]);
    expect(sortParamFromSorting(sorting, stringSorts, 'inverter')).toBe('-modulesInSeries');
  });

  it('falls back when a column the API cannot sort by is asked for', () => {
    expect(sortParamFromSorting([{ id: 'moduleModel', desc: false }], stringSorts, 'inverter')).toBe('inverter');
  });
});
