/** Capture time in the site's time zone, e.g. "3 Dec 2026, 14:05". */
export function formatCapturedAt(iso: string, timeZone?: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone }).format(date);
}

/** "52.12345° N, 4.98765° E": five decimals is about a metre, enough to find the module. */
export function formatGps(gps: { lat: number; lon: number }): string {
  const lat = `${Math.abs(gps.lat).toFixed(5)}° ${gps.lat >= 0 ? 'N' : 'S'}`;
  const lon = `${Math.abs(gps.lon).toFixed(5)}° ${gps.lon >= 0 ? 'E' : 'W'}`;
  return `${lat}, ${lon}`;
}

/** A link that opens the spot in OpenStreetMap. */
export function mapUrl(gps: { lat: number; lon: number }): string {
  return `https://www.openstreetmap.org/?mlat=${gps.lat.toFixed(6)}&mlon=${gps.lon.toFixed(6)}#map=19/${gps.lat.toFixed(6)}/${gps.lon.toFixed(6)}`;
}

export function formatNumber(value: number, digits = 1): string {
  return value.toFixed(digits).replace('-', '−');
}
