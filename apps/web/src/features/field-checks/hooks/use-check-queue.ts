import { useSyncExternalStore } from 'react';
import { checkQueueFor, type CheckQueue } from '../lib/check-queue';

/** The signed-in person's queue and its current contents, re-rendering as it changes. */
export function useCheckQueue(userId: number): { queue: CheckQueue; snapshot: ReturnType<CheckQueue['getSnapshot']> } {
  const queue = checkQueueFor(userId);
  const snapshot = useSyncExternalStore(queue.subscribe, queue.getSnapshot, queue.getSnapshot);
  return { queue, snapshot };
}
