import { describe, expect, it } from 'vitest';
import { labelUrl, qrPath } from './qr-path';

describe('qrPath', () => {
  it('draws a version-3 code (29 modules) for a string page address, finder pattern first', () => {
    const { size, path } = qrPath('https://stringfield.example/strings/769');
    expect(size).toBe(29);
    // The top-left finder pattern: a run of 7 dark modules on row 0.
    expect(path.startsWith('M0 0h7v1h-7z')).toBe(true);
  });

  it('gives the same drawing for the same address', () => {
    expect(qrPath('https://a.example/strings/1')).toEqual(qrPath('https://a.example/strings/1'));
  });
});

describe('labelUrl', () => {
  it('joins the origin and the path without a double slash', () => {
    expect(labelUrl('https://plant.example/', '/strings/12')).toBe('https://plant.example/strings/12');
  });
});
