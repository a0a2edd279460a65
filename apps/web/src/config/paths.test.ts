import { describe, expect, it } from 'vitest';
import { paths, safeNext, toSearch } from './paths';

describe('safeNext', () => {
  it.each([
    ['/people?role=technician', '/people?role=technician'],
    ['/outbox/abc#top', '/outbox/abc#top'],
    ['/', '/'],
  ])('keeps the in-app deep link %s', (next, expected) => {
    expect(safeNext(next)).toBe(expected);
  });

  it.each([
    ['an absolute URL', 'https://evil.example/phish'],
    ['a protocol-relative URL', '//evil.example'],
    ['a backslash trick', '/\\evil.example'],
    ['a javascript: URL', 'javascript:alert(1)'],
    ['a path with a control character', '/people\n'],
    ['the sign-in page itself', '/sign-in?next=/people'],
    ['the reset page', '/reset-password?token=x'],
    ['nothing at all', null],
  ])('sends %s home instead', (_what, next) => {
    expect(safeNext(next)).toBe('/');
  });
});

describe('paths', () => {
  it('carries the page asked for through sign-in', () => {
    expect(paths.signIn('/people?status=inactive')).toBe('/sign-in?next=%2Fpeople%3Fstatus%3Dinactive');
  });

  it('leaves next off when it would only lead home', () => {
    expect(paths.signIn('/')).toBe('/sign-in');
    expect(paths.signIn('https://evil.example')).toBe('/sign-in');
  });

  it('marks invitation links so the reset page can greet a newcomer', () => {
    expect(paths.resetPassword('tok-123', { isInvite: true })).toBe('/reset-password?token=tok-123&invite=1');
    expect(paths.resetPassword('tok-123')).toBe('/reset-password?token=tok-123');
  });

  it('encodes a mail id and keeps the outbox page', () => {
    expect(paths.outboxMessage('a/b c', { page: 3 })).toBe('/outbox/a%2Fb%20c?page=3');
    expect(paths.outboxMessage('m1', { page: 1 })).toBe('/outbox/m1');
  });
});

describe('toSearch', () => {
  it('drops empty values and returns nothing when none are left', () => {
    expect(toSearch({ q: '', role: undefined, page: 2, active: false })).toBe('?page=2');
    expect(toSearch({ q: '' })).toBe('');
  });
});
