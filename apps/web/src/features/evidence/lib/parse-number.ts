/**
 * What a numeric field holds, for react-hook-form's `setValueAs`: blank is "not given" (undefined),
 * a decimal comma counts as a point ("0,45" on a European phone keypad), anything else that is not
 * a number stays NaN so the schema's "must be a number" message shows.
 */
export function parseNumber(value: unknown): number | undefined {
  if (typeof value === 'number') return value;
  if (value === null || value === undefined) return undefined;
  if (typeof value !== 'string') return Number.NaN;
  const text = value.trim().replace(/\u2212/g, '-').replace(',', '.');
  if (text === '') return undefined;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)$/.test(text)) return Number.NaN;
  return Number(text);
}

/** A select of ids where "" means none: null, else the id. */
export function parseOptionalId(value: unknown): number | null {
  if (value === '' || value === null || value === undefined) return null;
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : null;
}
