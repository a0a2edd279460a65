import { describe, expect, it } from 'vitest';
import { parseNumber, parseOptionalId } from './parse-number';

describe('parseNumber', () => {
  it.each([
    ['0,45', 0.45],
    [' 612.4 ', 612.4],
    ['−3', -3],
    ['', undefined],
  ])('reads %j as %s', (text, value) => {
    expect(parseNumber(text)).toBe(value);
  });
  it('keeps junk as NaN so the schema says it must be a number', () => {
    expect(parseNumber('12 V')).toBeNaN();
  });
});

describe('parseOptionalId', () => {
  it('reads a chosen photo id, and "" as none', () => {
    expect(parseOptionalId('42')).toBe(42);
    expect(parseOptionalId('')).toBeNull();
  });
});
