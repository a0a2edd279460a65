/**
 * The first date or number a page formats makes the browser load its locale and time-zone data: 40–50 ms of
 * main thread on a mid-range phone (Chromium's ICU), whichever zone or pattern asked. A page that formats
 * dates in its first render (the board's deadlines, a ticket's checks) pays it there, in the middle of
 * drawing the page. Called at start-up instead, while the page's data is still on its way, it is paid when
 * the phone would otherwise wait.
 */
export function warmUpIntl(): void {
  try {
    new Intl.DateTimeFormat('en-GB', {
      timeZone: 'UTC',
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'short',
    }).format(0);
    new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 }).format(0);
  } catch {
    // A browser without Intl's full data formats later as it can; nothing to do here.
  }
}
