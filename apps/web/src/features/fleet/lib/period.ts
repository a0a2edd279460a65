import { faultCategorySchema, type FaultCategory } from '@stringfield/shared';
import { addDays, format, isValid, parseISO } from 'date-fns';
import { z } from 'zod';

/** A period preset: the last N days up to and including today. */
export const periodPresets = [
  { id: '30d', days: 30, label: 'Last 30 days' },
  { id: '90d', days: 90, label: 'Last 90 days' },
  { id: '365d', days: 365, label: 'Last 12 months' },
] as const;
export type PeriodPresetId = (typeof periodPresets)[number]['id'];

/** A period as the URL says it: a preset that moves with the calendar, or two fixed days. */
export type Period = { preset: PeriodPresetId } | { preset: null; from: string; to: string };

export const defaultPeriod: Period = { preset: '30d' };

const isoDay = z.iso.date();

const toDay = (d: Date) => format(d, 'yyyy-MM-dd');

/** The first and last day (inclusive, YYYY-MM-DD) a period covers, seen from `today`. */
export function periodRange(period: Period, today: Date = new Date()): { from: string; to: string } {
  if (period.preset === null) return { from: period.from, to: period.to };
  const preset = periodPresets.find((p) => p.id === period.preset) ?? periodPresets[0];
  return { from: toDay(addDays(today, -(preset.days - 1))), to: toDay(today) };
}

/** "Last 30 days" or "1 Sep 2026 – 30 Nov 2026". */
export function periodLabel(period: Period): string {
  if (period.preset !== null) return periodPresets.find((p) => p.id === period.preset)?.label ?? period.preset;
  const f = (day: string) => {
    const d = parseISO(day);
    return isValid(d) ? format(d, 'd MMM yyyy') : day;
  };
  return period.from === period.to ? f(period.from) : `${f(period.from)} – ${f(period.to)}`;
}

/**
 * Reads `?period=90d` or `?from=…&to=…`. A half-given, malformed or back-to-front range falls back
 * to the default preset rather than an error page: the period picker then shows what is applied.
 */
export function parsePeriod(search: URLSearchParams): Period {
  const preset = periodPresets.find((p) => p.id === search.get('period'));
  if (preset) return { preset: preset.id };
  const from = isoDay.safeParse(search.get('from') ?? undefined);
  const to = isoDay.safeParse(search.get('to') ?? undefined);
  if (from.success && to.success && from.data <= to.data) return { preset: null, from: from.data, to: to.data };
  return defaultPeriod;
}

export function periodSearch(period: Period): Record<string, string | undefined> {
  if (period.preset !== null) return { period: period.preset === defaultPeriod.preset ? undefined : period.preset };
  return { from: period.from, to: period.to };
}

/** Fleet pages share site, fault category and period in the URL, so a view can be sent on. */
export type FleetFilters = { siteId: number | undefined; faultCategory: FaultCategory | undefined; period: Period };

const siteIdParam = z.coerce.number().int().positive();

export function parseFleetFilters(search: URLSearchParams): FleetFilters {
  const siteId = siteIdParam.safeParse(search.get('siteId') ?? undefined);
  const faultCategory = faultCategorySchema.safeParse(search.get('faultCategory') ?? undefined);
  return {
    siteId: siteId.success ? siteId.data : undefined,
    faultCategory: faultCategory.success ? faultCategory.data : undefined,
    period: parsePeriod(search),
  };
}

export function fleetFiltersSearch(filters: FleetFilters): Record<string, string | number | undefined> {
  return { siteId: filters.siteId, faultCategory: filters.faultCategory, ...periodSearch(filters.period) };
}
