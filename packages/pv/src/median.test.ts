import { describe, expect, it } from 'vitest';
import { median } from './median.ts';

describe('median', () => {
  it.each([
    { values: [3, 1, 2], result: 2 },
    { values: [4, 1, 3, 2], result: 2.5 },
    { values: [720, 721, 700, 719], result: 719.5 },
  ])('gives $result for $values', ({ values, result }) => {
    expect(median(values)).toBe(result);
  });

  it('throws on an empty list', () => {
    expect(() => median([])).toThrow(RangeError);
  });
});
