/* Figures as the fleet pages print them: English grouping, fixed decimals, the unit after a space. */

const formatters = new Map<number, Intl.NumberFormat>();
function formatter(digits: number): Intl.NumberFormat {
  let f = formatters.get(digits);
  if (!f) formatters.set(digits, (f = new Intl.NumberFormat('en', { minimumFractionDigits: digits, maximumFractionDigits: digits })));
  return f;
}

export function formatNumber(value: number, digits = 0): string {
  return Number.isFinite(value) ? formatter(digits).format(value) : '–';
}

/** Watts as W below 10 kW, as kW (one decimal) above. */
export function formatPower(watts: number): string {
  return Math.abs(watts) >= 10_000 ? `${formatNumber(watts / 1000, 1)} kW` : `${formatNumber(watts)} W`;
}

export function formatKWhPerDay(kWh: number): string {
  return `${formatNumber(kWh, 1)} kWh/day`;
}

/** Hours as "5.1 h" up to two days, then "3.2 days"; null (nothing reached that step) → "–". */
export function formatDuration(hours: number | null): string {
  if (hours === null || !Number.isFinite(hours)) return '–';
  return hours < 48 ? `${formatNumber(hours, 1)} h` : `${formatNumber(hours / 24, 1)} days`;
}

/** A 0–1 rate as a whole percentage; null → "–". */
export function formatRate(rate: number | null): string {
  return rate === null || !Number.isFinite(rate) ? '–' : `${formatNumber(rate * 100)} %`;
}
