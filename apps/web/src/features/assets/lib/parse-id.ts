/** A route's `:id` as a positive whole number, or null for anything else (so the page can say "not found"). */
export function parseId(value: string | undefined): number | null {
  if (!value || !/^\d{1,10}$/.test(value)) return null;
  const id = Number(value);
  return Number.isSafeInteger(id) && id > 0 ? id : null;
}
