import { describe, expect, it } from 'vitest';
import { exportHref } from './exports';

describe('exportHref', () => {
  it('builds the CSV link for a site and period', () => {
    expect(exportHref('diode-replacements', { siteId: 1, from: '2026-09-01', to: '2026-11-30' })).toEqual({
      href: '/api/fleet/exports/diode-replacements.csv?siteId=1&from=2026-09-01&to=2026-11-30',
    });
  });

  it('asks for a site before offering a download', () => {
    expect(exportHref('tickets', { siteId: undefined, from: '2026-09-01', to: '2026-11-30' })).toEqual({ error: 'Choose a site' });
  });
});
