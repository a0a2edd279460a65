/** Formats a number for a technician's sentence: fixed decimals, ASCII minus, no thousands separator. */
export function formatNumber(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return text === `-${(0).toFixed(decimals)}` ? (0).toFixed(decimals) : text;
}
