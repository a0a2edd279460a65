import type { WorkOrderListItem } from '@stringfield/shared';
import { siteDayKey } from './sla';

export type MyWorkGroups = {
  overdue: WorkOrderListItem[];
  dueToday: WorkOrderListItem[];
  later: WorkOrderListItem[];
  /** Submitted, waiting for a supervisor: nothing for the technician to do right now. */
  waiting: WorkOrderListItem[];
};

/**
 * A technician's open tickets, most urgent first: overdue, then due before midnight of the reader's
 * own day (`viewerTimeZone`, the phone's zone), then later; tickets awaiting sign-off go last.
 * One zone for "today" keeps the groups in deadline order even when sites sit in different zones;
 * the cards still show each deadline in its site's time. Earliest deadline first within each group.
 */
export function groupMyWork(
  items: readonly WorkOrderListItem[],
  nowMs: number,
  viewerTimeZone: string,
): MyWorkGroups {
  const groups: MyWorkGroups = { overdue: [], dueToday: [], later: [], waiting: [] };
  const today = siteDayKey(new Date(nowMs), viewerTimeZone);
  const byDue = [...items].sort((a, b) => Date.parse(a.dueAt) - Date.parse(b.dueAt) || a.id - b.id);
  for (const item of byDue) {
    if (item.status === 'awaiting_signoff') groups.waiting.push(item);
    else if (Date.parse(item.dueAt) < nowMs) groups.overdue.push(item);
    else if (siteDayKey(item.dueAt, viewerTimeZone) === today) groups.dueToday.push(item);
    else groups.later.push(item);
  }
  return groups;
}

/** The zone the device runs in, for "today". */
export function deviceTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone;
}
