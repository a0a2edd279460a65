/**
 * What a numeric field holds, for react-hook-form's `setValueAs`: blank is "not given" (undefined),
 * a decimal comma is accepted as a point ("−0,29" from a European datasheet), anything else that is
 * not a number stays NaN so the schema's "must be a number" message shows.
 */
export function parseDecimal(value: unknown): number | undefined {
  if (typeof value === 'number') return value;
  if (value === null || value === undefined) return undefined;
  if (typeof value !== 'string') return Number.NaN;
  const text = value.trim().replace(/\u2212/g, '-').replace(',', '.');
  if (text === '') return undefined;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(text)) return Number.NaN;
  return Number(text);
}
