import type { StringCheck } from '@stringfield/shared';
import type { CheckQueueEntry } from './check-queue';

/** Adds a check the server just returned to the cached list; a correction greys the one it replaces. */
export function mergeSavedCheck(list: readonly StringCheck[] | undefined, saved: StringCheck): StringCheck[] {
  const rest = (list ?? []).filter((c) => c.id !== saved.id).map((c) => (saved.supersedesId !== null && c.id === saved.supersedesId ? { ...c, supersededById: saved.id } : c));
  return [...rest, saved].sort((a, b) => Date.parse(a.takenAt) - Date.parse(b.takenAt) || a.id - b.id);
}

/** The current (not superseded) check of each string, the latest by time of reading. */
export function latestCurrentByString(checks: readonly StringCheck[]): Map<number, StringCheck> {
  const latest = new Map<number, StringCheck>();
  for (const c of checks) {
    if (c.supersededById !== null) continue;
    const seen = latest.get(c.stringId);
    if (!seen || Date.parse(c.takenAt) > Date.parse(seen.takenAt) || (c.takenAt === seen.takenAt && c.id > seen.id)) latest.set(c.stringId, c);
  }
  return latest;
}

/** Queued readings of a ticket per string, oldest first. */
export function queuedByString(entries: readonly CheckQueueEntry[], workOrderId: number): Map<number, CheckQueueEntry[]> {
  const map = new Map<number, CheckQueueEntry[]>();
  for (const e of entries) {
    if (e.payload.workOrderId !== workOrderId) continue;
    map.set(e.payload.input.stringId, [...(map.get(e.payload.input.stringId) ?? []), e]);
  }
  return map;
}
