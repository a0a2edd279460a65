import { describe, expect, it } from 'vitest';
import { extractLinks, toInAppPath } from './extract-links';

describe('extractLinks', () => {
  it('finds the invitation link and drops the full stop that ends the sentence', () => {
    const text = 'Welcome! Choose a password at http://127.0.0.1:8080/reset-password?token=abc123&invite=1. The link expires in 72 hours.';
    expect(extractLinks(text)).toEqual(['http://127.0.0.1:8080/reset-password?token=abc123&invite=1']);
  });

  it('lists each link once and ignores anything that is not http(s)', () => {
    const text = 'See https://a.example/x and https://a.example/x again, or ftp://b.example/y, or javascript:alert(1)';
    expect(extractLinks(text)).toEqual(['https://a.example/x']);
  });
});

describe('toInAppPath', () => {
  it('keeps a link to this app in the same tab', () => {
    expect(toInAppPath('http://127.0.0.1:8080/reset-password?token=t#x', 'http://127.0.0.1:8080')).toBe('/reset-password?token=t#x');
  });

  it('leaves other sites alone', () => {
    expect(toInAppPath('https://elsewhere.example/reset', 'http://127.0.0.1:8080')).toBeNull();
  });
});
