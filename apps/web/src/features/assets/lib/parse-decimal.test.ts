import { describe, expect, it } from 'vitest';
import { parseDecimal } from './parse-decimal';

describe('parseDecimal', () => {
  it.each([
    ['49.8', 49.8],
    ['-0,29', -0.29],
    ['\u22120.27', -0.27],
    [' 1500 ', 1500],
    ['.5', 0.5],
  ])('reads %s from a datasheet as %d', (text, value) => {
    expect(parseDecimal(text)).toBe(value);
  });

  it('treats a blank field as not given, so optional values like NOCT can stay empty', () => {
    expect(parseDecimal('')).toBeUndefined();
    expect(parseDecimal('   ')).toBeUndefined();
  });

  it('keeps text that is no number as NaN, so the form says "must be a number"', () => {
    expect(parseDecimal('49.8 V')).toBeNaN();
    expect(parseDecimal('1.2.3')).toBeNaN();
  });
});
