import { describe, expect, it } from 'vitest';
import { solveLinearSystem } from './solve-linear-system.ts';

describe('solveLinearSystem', () => {
  it('solves a 3 × 3 system that needs pivoting (arithmetic: x = 1, 2, 3)', () => {
    const a = [
      [0, 2, 1],
      [1, 1, 1],
      [2, 0, 3],
    ];
    const x = solveLinearSystem(a, [7, 6, 11]);
    expect(x[0]).toBeCloseTo(1, 12);
    expect(x[1]).toBeCloseTo(2, 12);
    expect(x[2]).toBeCloseTo(3, 12);
  });

  it('throws on a singular matrix', () => {
    expect(() =>
      solveLinearSystem(
        [
          [1, 2],
          [2, 4],
        ],
        [1, 2],
      ),
    ).toThrow(RangeError);
  });
});
