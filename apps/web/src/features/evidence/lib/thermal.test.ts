import { describe, expect, it } from 'vitest';
import { classView, isIrradianceTooLow, previewDeltaT } from './thermal';

describe('thermal form helpers', () => {
  it('shows ΔT as hottest minus reference, to a tenth of a kelvin', () => {
    expect(previewDeltaT(58.34, 36.1)).toBe(22.2);
    expect(previewDeltaT(40, undefined)).toBeNull();
    expect(previewDeltaT(Number.NaN, 30)).toBeNull();
  });

  it('warns below the 600 W/m² IEC TS 62446-3 needs, not at it', () => {
    expect(isIrradianceTooLow(599)).toBe(true);
    expect(isIrradianceTooLow(600)).toBe(false);
    expect(isIrradianceTooLow(undefined)).toBe(false);
  });

  it.each([
    [3, false, 'CoA 3', 'fail'],
    [2, false, 'CoA 2', 'attention'],
    [1, false, 'CoA 1', 'pass'],
    [null, true, 'Conditions too poor', 'attention'],
  ] as const)('reads class %s (too poor: %s) as “%s” with tone %s and an icon', (coa, poor, title, tone) => {
    const view = classView(coa, poor);
    expect(view.title).toBe(title);
    expect(view.tone).toBe(tone);
    expect(view.icon).toBeTruthy();
  });
});
