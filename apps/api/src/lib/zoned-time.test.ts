import { describe, expect, it } from 'vitest';
import { exifDateTimeToDate, zonedWallClockToDate } from './zoned-time.ts';

const iso = (d: Date | null) => d?.toISOString() ?? null;

describe('zonedWallClockToDate', () => {
  it.each([
    // Zone rules from the IANA tz database (as shipped with Node's ICU).
    [
      'Europe/Berlin in winter (CET, +01:00)',
      { year: 2026, month: 11, day: 30, hour: 10, minute: 15, second: 0 },
      'Europe/Berlin',
      '2026-11-30T09:15:00.000Z',
    ],
    [
      'Europe/Berlin in summer (CEST, +02:00)',
      { year: 2026, month: 7, day: 1, hour: 10, minute: 15, second: 0 },
      'Europe/Berlin',
      '2026-07-01T08:15:00.000Z',
    ],
    [
      'America/Phoenix (MST all year, -07:00)',
      { year: 2026, month: 7, day: 1, hour: 6, minute: 0, second: 30 },
      'America/Phoenix',
      '2026-07-01T13:00:30.000Z',
    ],
    [
      'Australia/Adelaide in January (ACDT, +10:30)',
      { year: 2026, month: 1, day: 15, hour: 12, minute: 0, second: 0 },
      'Australia/Adelaide',
      '2026-01-15T01:30:00.000Z',
    ],
    [
      'a time Berlin skips (29 Mar 2026 02:30) moves forward by the gap',
      { year: 2026, month: 3, day: 29, hour: 2, minute: 30, second: 0 },
      'Europe/Berlin',
      '2026-03-29T01:30:00.000Z',
    ],
    [
      'a time Berlin has twice (25 Oct 2026 02:30) is the earlier one',
      { year: 2026, month: 10, day: 25, hour: 2, minute: 30, second: 0 },
      'Europe/Berlin',
      '2026-10-25T00:30:00.000Z',
    ],
    [
      'UTC',
      { year: 2026, month: 11, day: 30, hour: 10, minute: 15, second: 0 },
      'UTC',
      '2026-11-30T10:15:00.000Z',
    ],
  ])('%s', (_what, wall, zone, expected) => {
    expect(iso(zonedWallClockToDate(wall, zone))).toBe(expected);
  });

  it('throws for an unknown zone', () => {
    expect(() =>
      zonedWallClockToDate({ year: 2026, month: 1, day: 1, hour: 0, minute: 0, second: 0 }, 'Mars/Olympus'),
    ).toThrow(RangeError);
  });
});

describe('exifDateTimeToDate', () => {
  it('uses the offset the camera wrote, whatever the site zone', () => {
    expect(iso(exifDateTimeToDate('2026:11:30 10:15:00', '+09:30', 'Europe/Berlin'))).toBe(
      '2026-11-30T00:45:00.000Z',
    );
    expect(iso(exifDateTimeToDate('2026:11:30 10:15:00', '-05:00', 'Europe/Berlin'))).toBe(
      '2026-11-30T15:15:00.000Z',
    );
  });

  it('reads a time without offset in the site zone, and a blank offset counts as none', () => {
    expect(iso(exifDateTimeToDate('2026:11:30 10:15:00', undefined, 'Europe/Berlin'))).toBe(
      '2026-11-30T09:15:00.000Z',
    );
    expect(iso(exifDateTimeToDate('2026:11:30 10:15:00', '   :  ', 'Europe/Berlin'))).toBe(
      '2026-11-30T09:15:00.000Z',
    );
  });

  it('falls back to UTC for an unknown zone rather than dropping the time', () => {
    expect(iso(exifDateTimeToDate('2026:11:30 10:15:00', undefined, 'Nowhere/Else'))).toBe(
      '2026-11-30T10:15:00.000Z',
    );
  });

  it.each([
    ['blank', '    :  :     :  :  '],
    ['31 February', '2026:02:31 10:00:00'],
    ['hour 24', '2026:02:01 24:00:00'],
    ['not a string', 1234],
  ])('gives null for %s', (_what, raw) => {
    expect(exifDateTimeToDate(raw, undefined, 'UTC')).toBeNull();
  });
});
