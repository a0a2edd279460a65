import { DUE_SOON_HOURS, offsetMsAt, openStatuses, wallClockAt, type WorkOrderStatus } from '@stringfield/shared';

const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;

/** Where a ticket stands against its repair deadline. `stopped`: signed off or cancelled, the clock no longer runs. */
export type SlaState = 'overdue' | 'dueSoon' | 'onTrack' | 'stopped';

export function slaState(dueAt: string, status: WorkOrderStatus, nowMs: number): SlaState {
  if (!openStatuses.includes(status)) return 'stopped';
  const leftMs = Date.parse(dueAt) - nowMs;
  if (leftMs < 0) return 'overdue';
  if (leftMs <= DUE_SOON_HOURS * HOUR_MS) return 'dueSoon';
  return 'onTrack';
}

/**
 * A span of time for a clock: `3 h 12 min`, `40 min`, `2 d 5 h` (short) or the same in words (long,
 * for screen readers). Whole minutes, rounded down; from two days on, minutes are left out.
 */
export function formatDuration(ms: number, style: 'short' | 'long' = 'short'): string {
  const totalMinutes = Math.floor(Math.abs(ms) / MINUTE_MS);
  const unit = (n: number, short: string, singular: string) =>
    style === 'short' ? `${n} ${short}` : `${n} ${singular}${n === 1 ? '' : 's'}`;
  if (totalMinutes < 1) return style === 'short' ? 'under 1 min' : 'less than a minute';
  const days = Math.floor(totalMinutes / (24 * 60));
  const hours = Math.floor((totalMinutes % (24 * 60)) / 60);
  const minutes = totalMinutes % 60;
  const parts: string[] = [];
  if (totalMinutes >= 48 * 60) {
    parts.push(unit(days, 'd', 'day'));
    if (hours > 0) parts.push(unit(hours, 'h', 'hour'));
  } else {
    const allHours = Math.floor(totalMinutes / 60);
    if (allHours > 0) parts.push(unit(allHours, 'h', 'hour'));
    if (minutes > 0) parts.push(unit(minutes, 'min', 'minute'));
  }
  return parts.join(' ');
}

export type SlaCountdown = { state: SlaState; text: string; spokenText: string };

/** The live countdown: `due in 3 h 12 min`, `overdue by 40 min`, or the closed state when the clock stopped. */
export function slaCountdown(dueAt: string, status: WorkOrderStatus, nowMs: number): SlaCountdown {
  const state = slaState(dueAt, status, nowMs);
  const leftMs = Date.parse(dueAt) - nowMs;
  if (state === 'stopped') {
    return status === 'cancelled'
      ? { state, text: 'cancelled', spokenText: 'cancelled, no deadline any more' }
      : { state, text: 'closed', spokenText: 'closed, the clock has stopped' };
  }
  if (state === 'overdue') {
    return {
      state,
      text: `overdue by ${formatDuration(leftMs)}`,
      spokenText: `overdue by ${formatDuration(leftMs, 'long')}`,
    };
  }
  return {
    state,
    text: `due in ${formatDuration(leftMs)}`,
    spokenText: `due in ${formatDuration(leftMs, 'long')}`,
  };
}

// Formatters by locale, zone and options. Making an Intl.DateTimeFormat costs far more than using one,
// and a board renders a deadline per row (25 rows, a handful of zones).
const siteTimeFormats = new Map<string, Intl.DateTimeFormat>();

/**
 * A moment as the site's clock shows it, e.g. `Tue 14 Oct, 15:30 CEST`. Plants are worked in local
 * time, so deadlines and history read in the site's zone, with the zone named.
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

/** The calendar day (`2025-10-14`) a moment falls on at the site. */
export function siteDayKey(at: Date | string, timeZone: string): string {
  const p = wallClockAt(typeof at === 'string' ? new Date(at) : at, timeZone);
  return `${p.year}-${String(p.month).padStart(2, '0')}-${String(p.day).padStart(2, '0')}`;
}

/** Minutes the zone is ahead of UTC at that moment (CEST: 120). */
function offsetMinutes(date: Date, timeZone: string): number {
  return Math.round(offsetMsAt(date.getTime(), timeZone) / MINUTE_MS);
}

/** An ISO moment as the value of a `datetime-local` input showing site time (`2025-10-14T15:30`). */
export function toSiteInputValue(iso: string, timeZone: string): string {
  const p = wallClockAt(new Date(iso), timeZone);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${p.year}-${pad(p.month)}-${pad(p.day)}T${pad(p.hour)}:${pad(p.minute)}`;
}

/**
 * A `datetime-local` value read as site wall-clock time, back to an ISO moment with offset (UTC `Z`).
 * Returns undefined for an empty or malformed value. Across a DST change the second pass settles the offset.
 */
export function fromSiteInputValue(value: string, timeZone: string): string | undefined {
  const match = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(value);
  if (!match) return undefined;
  const [, y, mo, d, h, mi] = match.map(Number) as [number, number, number, number, number, number];
  const wallAsUtc = Date.UTC(y, mo - 1, d, h, mi);
  let guess = wallAsUtc - offsetMinutes(new Date(wallAsUtc), timeZone) * MINUTE_MS;
  guess = wallAsUtc - offsetMinutes(new Date(guess), timeZone) * MINUTE_MS;
  return new Date(guess).toISOString();
}
