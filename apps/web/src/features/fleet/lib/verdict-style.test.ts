import { describe, expect, it } from 'vitest';
import { buildHealthCell } from './test-factories';
import { cellAccessibleName, cellVerdict, formatDeviation, verdictStyles } from './verdict-style';

describe('verdictStyles', () => {
  it.each([
    ['fail', 'Fail', 'cross-hatched', '✕'],
    ['attention', 'Needs attention', 'striped', '!'],
    ['pass', 'Pass', 'solid', ''],
    ['unchecked', 'Not checked', 'outline', ''],
  ] as const)('draws %s as "%s", %s, with glyph "%s"', (verdict, label, pattern, glyph) => {
    expect(verdictStyles[verdict]).toMatchObject({ label, pattern, glyph });
  });

  it('gives every verdict its own pattern, so none relies on colour alone', () => {
    const patterns = Object.values(verdictStyles).map((s) => s.pattern);
    expect(new Set(patterns).size).toBe(patterns.length);
  });

  it('treats a string without a current check as not checked', () => {
    expect(cellVerdict(buildHealthCell({ verdict: null }))).toBe('unchecked');
  });
});

describe('formatDeviation', () => {
  it('writes a true minus sign and one decimal', () => {
    expect(formatDeviation(-12.34)).toBe('−12.3 %');
    expect(formatDeviation(2)).toBe('+2.0 %');
    expect(formatDeviation(null)).toBe('–');
  });
});

describe('cellAccessibleName', () => {
  it('says the label, verdict, deviations, day and tickets of a failed string', () => {
    const cell = buildHealthCell({ label: 'INV07-MPPT3-S2', verdict: 'fail', vocDeviationPct: -16.5, iscDeviationPct: -0.4, checkedAt: '2026-11-03T10:00:00Z', openTickets: 1 });
    expect(cellAccessibleName(cell)).toBe('INV07-MPPT3-S2: Fail. Voc −16.5 % · Isc −0.4 %. Checked 3 Nov 2026. 1 open ticket.');
  });

  it('says plainly that an unchecked string was never checked', () => {
    expect(cellAccessibleName(buildHealthCell({ label: 'S1' }))).toBe('S1: Not checked. No current check. Never checked. No open ticket.');
  });
});
