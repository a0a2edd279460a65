import { describe, expect, it } from 'vitest';
import { assertNumber } from './assert-number.ts';

describe('assertNumber', () => {
  it.each([
    { value: Number.NaN, limits: {} },
    { value: Infinity, limits: {} },
    { value: 1.5, limits: { integer: true } },
    { value: -1, limits: { min: 0 } },
    { value: 2, limits: { max: 1 } },
    { value: 0, limits: { greaterThan: 0 } },
    { value: 1, limits: { lessThan: 1 } },
  ])('rejects $value with $limits', ({ value, limits }) => {
    expect(() => assertNumber(value, 'x', limits)).toThrow(/^x must/);
  });

  it('accepts a number inside its limits', () => {
    expect(() =>
      assertNumber(3, 'x', { integer: true, min: 1, max: 5, greaterThan: 2, lessThan: 4 }),
    ).not.toThrow();
  });
});
