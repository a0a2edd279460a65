import { describe, expect, it } from 'vitest';
import { fitPolynomial } from './fit-polynomial.ts';

describe('fitPolynomial', () => {
  it('recovers 2 − 3x + 0.5x² from exact samples far from the origin (arithmetic)', () => {
    const xs = Array.from({ length: 9 }, (_, k) => 600 + k * 5);
    const c = fitPolynomial(
      xs,
      xs.map((x) => 2 - 3 * x + 0.5 * x * x),
      2,
    );
    expect(c[2]).toBeCloseTo(0.5, 8);
    expect(c[1]).toBeCloseTo(-3, 5);
  });

  it('fits the least-squares line through (0, 0), (1, 1), (2, 1): y = 1/6 + x/2 (arithmetic)', () => {
    const c = fitPolynomial([0, 1, 2], [0, 1, 1], 1);
    expect(c[0]).toBeCloseTo(1 / 6, 12);
    expect(c[1]).toBeCloseTo(0.5, 12);
  });

  it('throws with too few points', () => {
    expect(() => fitPolynomial([1, 2], [1, 2], 2)).toThrow(RangeError);
  });
});
