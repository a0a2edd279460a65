// EXIF times read in a site's zone; the zone arithmetic itself is packages/shared's.
import { offsetMsAt, wallClockAt, zonedWallClockToDate, type WallClock } from '@stringfield/shared';

export { offsetMsAt, wallClockAt, zonedWallClockToDate, type WallClock };

const EXIF_DATE = /^(\d{4})[:-](\d{2})[:-](\d{2})[ T](\d{2}):(\d{2}):(\d{2})/;
const EXIF_OFFSET = /^([+-])(\d{2}):(\d{2})$/;

/**
 * An EXIF date-time ("2026:11:30 10:15:00", no zone) as an instant: with its EXIF offset ("+01:00") when the
 * camera wrote one, else read as wall-clock time in `timeZone`. Null when the value is blank or not a date.
 */
export function exifDateTimeToDate(raw: unknown, offset: unknown, timeZone: string): Date | null {
  if (typeof raw !== 'string') return null;
  const m = EXIF_DATE.exec(raw.trim());
  if (!m) return null;
  const [year, month, day, hour, minute, second] = m.slice(1).map(Number) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  const check = new Date(Date.UTC(year, month - 1, day, hour, minute, second));
  if (
    check.getUTCMonth() !== month - 1 ||
    check.getUTCDate() !== day ||
    hour > 23 ||
    minute > 59 ||
    second > 59
  )
    return null;
  const o = typeof offset === 'string' ? EXIF_OFFSET.exec(offset.trim()) : null;
  let date: Date;
  if (o) {
    const offsetMs = (o[1] === '-' ? -1 : 1) * (Number(o[2]) * 60 + Number(o[3])) * 60_000;
    date = new Date(check.getTime() - offsetMs);
  } else {
    try {
      date = zonedWallClockToDate({ year, month, day, hour, minute, second }, timeZone);
    } catch {
      date = check;
    }
  }
  return Number.isNaN(date.getTime()) ? null : date;
}
