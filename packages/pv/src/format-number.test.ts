import { describe, expect, it } from 'vitest';
import { formatNumber } from './format-number.ts';

describe('formatNumber', () => {
  it.each([
    { value: 12.766, decimals: 1, text: '12.8' },
    { value: -0.01, decimals: 1, text: '0.0' },
    { value: -765.2, decimals: 1, text: '-765.2' },
    { value: 9.43, decimals: 2, text: '9.43' },
  ])('writes $value with $decimals decimals as $text', ({ value, decimals, text }) => {
    expect(formatNumber(value, decimals)).toBe(text);
  });
});
