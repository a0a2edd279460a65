/** Numbers for readings: fixed decimals, a real minus sign, tabular in the UI through the `readings` class. */
export function formatNumber(value: number, decimals = 1): string {
  // A value that rounds to zero is shown as 0, never "−0.0".
  if (Math.abs(value) < 0.5 * 10 ** -decimals) value = 0;
  const text = new Intl.NumberFormat('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value);
  return text.replace('-', '−');
}

/** A signed percentage: "+2.1 %", "−6.3 %". */
export function formatDeviation(pct: number): string {
  const rounded = Math.round(pct * 10) / 10 || 0;
  const sign = rounded > 0 ? '+' : '';
  return `${sign}${formatNumber(rounded, 1)} %`;
}

/** "12:31" for today, "3 Dec, 12:31" otherwise, in the device's time zone. */
export function formatTakenAt(iso: string, now = new Date()): string {
  const at = new Date(iso);
  const time = at.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  if (at.toDateString() === now.toDateString()) return time;
  return `${at.toLocaleDateString('en-GB', { day: 'numeric', month: 'short' })}, ${time}`;
}

/** The device's calendar day, YYYY-MM-DD (local time, not UTC: a day in the field is a local day). */
export function localDay(date = new Date()): string {
  const y = date.getFullYear();
  const m = String(date.getMonth() + 1).padStart(2, '0');
  const d = String(date.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}
