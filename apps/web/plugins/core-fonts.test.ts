import { describe, expect, it } from 'vitest';
import { parseUnicodeRange, toUnicodeRange, wantedRanges } from './core-fonts';

// CSS Fonts Module Level 4 §4.5 (unicode-range): "U+" then one code point, or two joined by "-", in hex.
describe('unicode-range values of the core faces', () => {
  it('joins neighbouring code points into ranges and keeps single ones apart', () => {
    expect(toUnicodeRange([0x41, 0x42, 0x43, 0xd7, 0x2212, 0x2013, 0x2014])).toBe('U+0041-0043,U+00D7,U+2013-2014,U+2212');
  });

  it('reads back what it writes, and the packages’ own form', () => {
    const latin = 'U+0000-00FF,U+0131,U+0152-0153,U+2000-206F,U+FEFF';
    const points = parseUnicodeRange(latin);
    expect(points).toHaveLength(256 + 1 + 2 + 112 + 1);
    expect(toUnicodeRange(points)).toBe(latin);
  });

  it('refuses a value that is not a range', () => {
    expect(() => parseUnicodeRange('U+00ZZ')).toThrow(/not a unicode-range part/);
  });

  it('wants printable ASCII and the signs the readings use', () => {
    const wanted = new Set(wantedRanges.flatMap(([a, b]) => Array.from({ length: b - a + 1 }, (_, k) => a + k)));
    for (const sign of ' AZaz09°²µ±·×−–—…’') expect(wanted.has(sign.codePointAt(0)!), sign).toBe(true);
  });
});
