import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findRoot } from './find-root.ts';

describe('findRoot (Brent)', () => {
  it('finds √2 as the root of x² − 2 on [0, 2] (arithmetic)', () => {
    expect(findRoot((x) => x * x - 2, 0, 2)).toBeCloseTo(Math.SQRT2, 11);
  });

  it('finds the root of any line inside the bracket (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        (root, slope) => {
          expect(findRoot((x) => slope * (x - root), root - 7, root + 3)).toBeCloseTo(root, 9);
        },
      ),
    );
  });

  it('throws when the bracket has no sign change', () => {
    expect(() => findRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });
});
