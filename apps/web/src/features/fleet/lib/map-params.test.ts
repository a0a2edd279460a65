import { describe, expect, it } from 'vitest';
import { defaultMapParams, mapSearch, matchesCell, parseMapParams } from './map-params';
import { buildHealthCell } from './test-factories';

describe('health map URL', () => {
  it('reads verdict, open-tickets-only, inverter and list view', () => {
    expect(parseMapParams(new URLSearchParams('verdict=fail&open=1&inverter=INV07&view=list'))).toEqual({
      verdict: 'fail',
      isOpenOnly: true,
      inverter: 'INV07',
      view: 'list',
    });
  });

  it('ignores values it does not know instead of failing', () => {
    expect(parseMapParams(new URLSearchParams('verdict=purple&open=yes&view=3d'))).toEqual(defaultMapParams);
  });

  it('round-trips through the URL and leaves defaults out', () => {
    const params = { ...defaultMapParams, verdict: 'attention' as const, inverter: 'INV02' };
    const search = new URLSearchParams(Object.entries(mapSearch(params)).filter((e): e is [string, string] => e[1] !== undefined));
    expect(search.toString()).toBe('verdict=attention&inverter=INV02');
    expect(parseMapParams(search)).toEqual(params);
  });
});

describe('matchesCell', () => {
  it('keeps unchecked strings lit when filtering for unchecked', () => {
    expect(matchesCell(buildHealthCell({ verdict: null }), { verdict: 'unchecked', isOpenOnly: false })).toBe(true);
    expect(matchesCell(buildHealthCell({ verdict: 'pass' }), { verdict: 'unchecked', isOpenOnly: false })).toBe(false);
  });

  it('with open tickets only, dims strings no open ticket covers', () => {
    expect(matchesCell(buildHealthCell({ openTickets: 0 }), { verdict: undefined, isOpenOnly: true })).toBe(false);
    expect(matchesCell(buildHealthCell({ openTickets: 2 }), { verdict: undefined, isOpenOnly: true })).toBe(true);
  });
});
