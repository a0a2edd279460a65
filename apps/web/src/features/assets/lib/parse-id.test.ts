import { describe, expect, it } from 'vitest';
import { parseId } from './parse-id';

describe('parseId', () => {
  it('reads the string id of a QR label link', () => {
    expect(parseId('769')).toBe(769);
  });

  it.each([undefined, '', '0', '-3', '12abc', '1e3', '99999999999'])('refuses %s', (value) => {
    expect(parseId(value)).toBeNull();
  });
});
