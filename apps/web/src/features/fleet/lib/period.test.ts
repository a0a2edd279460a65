import { describe, expect, it } from 'vitest';
import { fleetFiltersSearch, parseFleetFilters, parsePeriod, periodLabel, periodRange, periodSearch } from './period';

const today = new Date(2026, 11, 2); // 2 Dec 2026, local time

describe('period presets', () => {
  it('makes "last 30 days" the 30 days ending today, today included', () => {
    expect(periodRange({ preset: '30d' }, today)).toEqual({ from: '2026-11-03', to: '2026-12-02' });
  });

  it('makes "last 90 days" reach back across the month ends', () => {
    expect(periodRange({ preset: '90d' }, today)).toEqual({ from: '2026-09-04', to: '2026-12-02' });
  });

  it('keeps a custom range as given', () => {
    expect(periodRange({ preset: null, from: '2026-09-01', to: '2026-11-30' }, today)).toEqual({ from: '2026-09-01', to: '2026-11-30' });
  });

  it('labels presets by name and custom ranges by their days', () => {
    expect(periodLabel({ preset: '90d' })).toBe('Last 90 days');
    expect(periodLabel({ preset: null, from: '2026-09-01', to: '2026-11-30' })).toBe('1 Sep 2026 – 30 Nov 2026');
  });
});

describe('period in the URL', () => {
  it('defaults to the last 30 days and leaves it out of the URL', () => {
    expect(parsePeriod(new URLSearchParams(''))).toEqual({ preset: '30d' });
    expect(periodSearch({ preset: '30d' })).toEqual({ period: undefined });
  });

  it('reads a preset or a from/to pair', () => {
    expect(parsePeriod(new URLSearchParams('period=90d'))).toEqual({ preset: '90d' });
    expect(parsePeriod(new URLSearchParams('from=2026-09-01&to=2026-11-30'))).toEqual({ preset: null, from: '2026-09-01', to: '2026-11-30' });
  });

  it('falls back to the default for a back-to-front, half-given or malformed range', () => {
    expect(parsePeriod(new URLSearchParams('from=2026-11-30&to=2026-09-01'))).toEqual({ preset: '30d' });
    expect(parsePeriod(new URLSearchParams('from=2026-09-01'))).toEqual({ preset: '30d' });
    expect(parsePeriod(new URLSearchParams('from=1/9/2026&to=30/11/2026'))).toEqual({ preset: '30d' });
  });
});

describe('fleet filters in the URL', () => {
  it('reads site, fault category and period together, dropping what does not parse', () => {
    expect(parseFleetFilters(new URLSearchParams('siteId=2&faultCategory=fuse&period=90d'))).toEqual({ siteId: 2, faultCategory: 'fuse', period: { preset: '90d' } });
    expect(parseFleetFilters(new URLSearchParams('siteId=abc&faultCategory=gremlins'))).toEqual({ siteId: undefined, faultCategory: undefined, period: { preset: '30d' } });
  });

  it('writes a custom period as from and to', () => {
    expect(fleetFiltersSearch({ siteId: 1, faultCategory: undefined, period: { preset: null, from: '2026-09-01', to: '2026-09-30' } })).toEqual({
      siteId: 1,
      faultCategory: undefined,
      from: '2026-09-01',
      to: '2026-09-30',
    });
  });
});
