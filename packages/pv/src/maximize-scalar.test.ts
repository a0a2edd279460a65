import { describe, expect, it } from 'vitest';
import { maximizeScalar } from './maximize-scalar.ts';

describe('maximizeScalar (golden section)', () => {
  it('finds the top of −(x − 1.3)² on [0, 5] (arithmetic)', () => {
    expect(maximizeScalar((x) => -((x - 1.3) ** 2), 0, 5, 1e-12)).toBeCloseTo(1.3, 6);
  });

  it('finds the maximum of x·e^(−x) at x = 1 (calculus)', () => {
    expect(maximizeScalar((x) => x * Math.exp(-x), 0, 4, 1e-12)).toBeCloseTo(1, 6);
  });
});
