// Wall-clock times in an IANA zone and back, with Intl only (no time-zone package is installed). Used by the
// API (EXIF times, schedules) and the web app (site times in forms and lists).

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

export type WallClock = {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
};

/** What a clock in the IANA zone shows at instant `at` (a Date or epoch milliseconds). */
export function wallClockAt(at: Date | number, timeZone: string): WallClock {
  const parts = formatter(timeZone).formatToParts(at);
  const n = (type: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === type)?.value);
  return { year: n('year'), month: n('month'), day: n('day'), hour: n('hour'), minute: n('minute'), second: n('second') };
}

/** The zone's offset from UTC at instant `ms`, in milliseconds (east positive). */
export function offsetMsAt(ms: number, timeZone: string): number {
  const w = wallClockAt(ms, timeZone);
  const wall = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  return wall - Math.floor(ms / 1000) * 1000;
}

/**
 * The instant a wall-clock time names in an IANA zone. Like Temporal's 'compatible' choice: a time that
 * occurs twice (clocks set back) is the earlier one; a time skipped by clocks going forward moves forward by the gap.
 * Throws RangeError for an unknown zone.
 */
export function zonedWallClockToDate(w: WallClock, timeZone: string): Date {
  const wallMs = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  // Offsets half a day either side bracket any single transition.
  const before = offsetMsAt(wallMs - 12 * 3_600_000, timeZone);
  const after = offsetMsAt(wallMs + 12 * 3_600_000, timeZone);
  const fits = [before, after].map((o) => wallMs - o).filter((t) => offsetMsAt(t, timeZone) === wallMs - t);
  return new Date(fits.length ? Math.min(...fits) : wallMs - before);
}

// Formatters by locale, zone and options. Making an Intl.DateTimeFormat costs far more than using one,
// and a board renders a deadline per row (25 rows, a handful of zones).
const siteTimeFormats = new Map<string, Intl.DateTimeFormat>();

/**
 * A moment as the site's clock shows it, e.g. `Tue 14 Oct, 15:30 CEST`. Plants are worked in local
 * time, so deadlines and history read in the site's zone, with the zone named. The web app uses it
 * everywhere it shows a site time; the API uses it for the deadline of every listed ticket
 * (`dueAtSiteTime`), so that a phone can draw a list of deadlines without making a date formatter of
 * its own: the first one a page makes loads the browser's locale data, 30 to 45 ms of one task on a
 * desktop and several times that on a phone.
 */
export function formatSiteTime(
  iso: string,
  timeZone: string,
  options: { withWeekday?: boolean; withYear?: boolean; locale?: string } = {},
): string {
  const { withWeekday = true, withYear = false, locale = 'en-GB' } = options;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  try {
    const key = `${locale}|${timeZone}|${withWeekday}|${withYear}`;
    let format = siteTimeFormats.get(key);
    if (!format) {
      format = new Intl.DateTimeFormat(locale, {
        timeZone,
        weekday: withWeekday ? 'short' : undefined,
        day: 'numeric',
        month: 'short',
        year: withYear ? 'numeric' : undefined,
        hour: '2-digit',
        minute: '2-digit',
        hourCycle: 'h23',
        timeZoneName: 'short',
      });
      siteTimeFormats.set(key, format);
    }
    return format.format(date);
  } catch {
    return date.toISOString();
  }
}
