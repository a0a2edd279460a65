import { describe, expect, it } from 'vitest';
import { countSizingFailures, sizingHeadline } from './sizing-summary';

describe('countSizingFailures', () => {
  it('counts each failing check once per string, most common first, in words', () => {
    const strings = [
      { sizingFailures: ['COLD_VOC_BELOW_MAX_DC', 'POWER_WITHIN_ENVELOPE'] },
      { sizingFailures: ['COLD_VOC_BELOW_MAX_DC', 'COLD_VOC_BELOW_MAX_DC'] },
      { sizingFailures: [] },
    ];
    expect(countSizingFailures(strings)).toEqual([
      { code: 'COLD_VOC_BELOW_MAX_DC', label: 'Cold Voc under the inverter maximum', count: 2 },
      { code: 'POWER_WITHIN_ENVELOPE', label: 'Array power inside the inverter power envelope', count: 1 },
    ]);
  });

  it('keeps a check the web app has no words for under its code', () => {
    expect(countSizingFailures([{ sizingFailures: ['NEW_CHECK'] }])).toEqual([{ code: 'NEW_CHECK', label: 'NEW_CHECK', count: 1 }]);
  });
});

describe('sizingHeadline', () => {
  it.each([
    [24, 192, '24 of 192 strings fail at least one sizing check'],
    [0, 600, 'All 600 strings pass every sizing check'],
    [0, 0, 'No strings registered yet'],
  ])('says %i failing of %i as "%s"', (failing, total, text) => {
    expect(sizingHeadline(failing, total)).toBe(text);
  });
});
