import { format, formatDistanceToNowStrict, parseISO } from 'date-fns';

/** "5 min ago" for recent mail, with the exact time for a tooltip or a second line. */
export function describeReceived(iso: string): { relative: string; exact: string } {
  try {
    const date = parseISO(iso);
    return { relative: `${formatDistanceToNowStrict(date)} ago`, exact: format(date, 'd MMM yyyy, HH:mm:ss') };
  } catch {
    return { relative: iso, exact: iso };
  }
}
