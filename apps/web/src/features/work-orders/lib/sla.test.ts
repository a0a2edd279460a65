import { describe, expect, it } from 'vitest';
import {
  formatDuration,
  formatSiteTime,
  fromSiteInputValue,
  siteDayKey,
  slaCountdown,
  slaState,
  toSiteInputValue,
} from './sla';

const now = Date.parse('2025-10-14T10:00:00Z');
const at = (minutesFromNow: number) => new Date(now + minutesFromNow * 60_000).toISOString();

describe('slaCountdown', () => {
  it.each([
    ['a P1 with 3 h 12 min left', 192, 'due in 3 h 12 min', 'due in 3 hours 12 minutes', 'onTrack'],
    ['exactly two hours left (still due soon)', 120, 'due in 2 h', 'due in 2 hours', 'dueSoon'],
    ['forty minutes left', 40, 'due in 40 min', 'due in 40 minutes', 'dueSoon'],
    ['seconds left', 0.5, 'due in under 1 min', 'due in less than a minute', 'dueSoon'],
    ['forty minutes late', -40, 'overdue by 40 min', 'overdue by 40 minutes', 'overdue'],
    ['one hour one minute late', -61, 'overdue by 1 h 1 min', 'overdue by 1 hour 1 minute', 'overdue'],
    ['a P4 with ten days left', 10 * 24 * 60 + 65, 'due in 10 d 1 h', 'due in 10 days 1 hour', 'onTrack'],
    [
      '47 h left still counts hours',
      47 * 60 + 5,
      'due in 47 h 5 min',
      'due in 47 hours 5 minutes',
      'onTrack',
    ],
  ])('reads %s', (_case, minutes, text, spoken, state) => {
    expect(slaCountdown(at(minutes), 'in_field', now)).toEqual({ text, spokenText: spoken, state });
  });

  it('stops the clock once a ticket is signed off, however late it was', () => {
    expect(slaCountdown(at(-600), 'signed_off', now).state).toBe('stopped');
    expect(slaCountdown(at(-600), 'cancelled', now).text).toBe('cancelled');
    expect(slaCountdown(at(-600), 'signed_off', now).spokenText).toBe('closed, the clock has stopped');
  });

  it('keeps running while a ticket waits for sign-off', () => {
    expect(slaState(at(-1), 'awaiting_signoff', now)).toBe('overdue');
  });
});

describe('formatDuration', () => {
  it('drops zero parts and rounds down to whole minutes', () => {
    expect(formatDuration(3 * 3_600_000 + 59_999)).toBe('3 h');
    expect(formatDuration(2 * 86_400_000, 'long')).toBe('2 days');
  });
});

describe('site time', () => {
  it('shows a deadline in the site zone with the zone named', () => {
    expect(formatSiteTime('2025-10-14T13:30:00Z', 'Europe/Berlin')).toBe('Tue 14 Oct, 15:30 CEST');
    expect(formatSiteTime('2025-10-14T13:30:00Z', 'America/Edmonton', { withWeekday: false })).toBe(
      '14 Oct, 07:30 GMT-6',
    );
  });

  it('puts a late-evening UTC moment on the next calendar day in Berlin', () => {
    expect(siteDayKey('2025-10-14T22:30:00Z', 'Europe/Berlin')).toBe('2025-10-15');
    expect(siteDayKey('2025-10-14T22:30:00Z', 'UTC')).toBe('2025-10-14');
  });

  it.each([
    ['summer time in Berlin', '2025-07-01T08:15:00.000Z', 'Europe/Berlin', '2025-07-01T10:15'],
    ['winter time in Berlin', '2025-12-01T08:15:00.000Z', 'Europe/Berlin', '2025-12-01T09:15'],
    ['Edmonton across midnight', '2025-12-01T03:00:00.000Z', 'America/Edmonton', '2025-11-30T20:00'],
  ])('round-trips a datetime-local value in %s', (_case, iso, tz, local) => {
    expect(toSiteInputValue(iso, tz)).toBe(local);
    expect(fromSiteInputValue(local, tz)).toBe(iso);
  });

  it('refuses a malformed input value', () => {
    expect(fromSiteInputValue('', 'Europe/Berlin')).toBeUndefined();
    expect(fromSiteInputValue('14/10/2025 15:30', 'Europe/Berlin')).toBeUndefined();
  });
});
