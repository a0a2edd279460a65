/* Readings as a technician reads them: a fixed number of decimals per unit, thin grouping, the unit
   after a space. Locale is English so a "1,605.2 V" reads the same on every phone in a crew. */

const formatters = new Map<number, Intl.NumberFormat>();

function formatter(digits: number): Intl.NumberFormat {
  let f = formatters.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    formatters.set(digits, f);
  }
  return f;
}

/** Default decimals per unit: volts and watts to 0.1 / 1, amps to 0.01. */
const digitsByUnit: Record<string, number> = { V: 1, A: 2, W: 0, kW: 1, '°C': 1, 'W/m²': 0, '%': 0, '%/°C': 3 };

/** `formatQuantity(1605.23, 'V')` → "1,605.2 V". */
export function formatQuantity(value: number, unit: string, digits?: number): string {
  if (!Number.isFinite(value)) return '–';
  return `${formatter(digits ?? digitsByUnit[unit] ?? 1).format(value)} ${unit}`;
}

/** A plain number with the given decimals. */
export function formatNumber(value: number, digits = 0): string {
  if (!Number.isFinite(value)) return '–';
  return formatter(digits).format(value);
}

/** Watts, switching to kW from 10 kW so string and input powers stay short. */
export function formatPower(watts: number): string {
  return Math.abs(watts) >= 10_000 ? formatQuantity(watts / 1000, 'kW') : formatQuantity(watts, 'W');
}
