import fc from 'fast-check';
import { lambertW0Log } from 'lambert-w-function';
import { describe, expect, it } from 'vitest';
import { lambertWLog } from './lambert-w-log.ts';

describe('lambertWLog', () => {
  it.each([
    // W(1) = Ω, the omega constant 0.5671432904097838 (trade fact of the Lambert W function)
    { lnX: 0, w: 0.5671432904097838 },
    // W(e) = 1 by definition (w·e^w = e)
    { lnX: 1, w: 1 },
    // W(2e²) = 2 by definition: ln x = ln 2 + 2
    { lnX: Math.log(2) + 2, w: 2 },
  ])('returns W = $w for ln x = $lnX (definition of W)', ({ lnX, w }) => {
    expect(lambertWLog(lnX)).toBeCloseTo(w, 14);
  });

  it('agrees with the npm lambert-w-function reference over ln x from −30 to 2000 (pv-field-testing §10)', () => {
    fc.assert(
      fc.property(fc.double({ min: -30, max: 2000, noNaN: true }), (lnX) => {
        const ours = lambertWLog(lnX);
        const reference = lambertW0Log(lnX);
        expect(Math.abs(ours - reference)).toBeLessThanOrEqual(1e-12 * Math.max(1, reference));
      }),
    );
  });

  it('solves w + ln w = ln x to double precision where exp(ln x) would overflow (pv-field-testing §5.2)', () => {
    fc.assert(
      fc.property(fc.double({ min: 710, max: 1e6, noNaN: true }), (lnX) => {
        const w = lambertWLog(lnX);
        expect(Math.abs(w + Math.log(w) - lnX)).toBeLessThanOrEqual(4e-16 * lnX);
      }),
    );
  });

  it('returns x itself for tiny x, where W(x) = x − x² + … (series of W)', () => {
    expect(lambertWLog(-50)).toBe(Math.exp(-50));
  });

  it('throws on NaN (programmer error)', () => {
    expect(() => lambertWLog(Number.NaN)).toThrow(RangeError);
  });
});
