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
