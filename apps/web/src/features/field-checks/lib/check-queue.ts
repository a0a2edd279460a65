import { stringCheckSchema, workOrderStatusLabels, workOrderStatusSchema, type StringCheck, type StringCheckInput } from '@stringfield/shared';
import { get, set } from 'idb-keyval';
import { api, errorBodyField, isApiError } from '@/lib/api-client';
import { createOfflineQueue, type OfflineQueue, type QueueEntry, type QueueStore, type SendOutcome } from '@/lib/offline-queue';
import type { Verdict } from './preview';

/** A reading waiting on the phone: a new check, or a correction of a saved one. */
export type QueuedCheck = {
  kind: 'check' | 'revision';
  workOrderId: number;
  workOrderNumber: string;
  stringLabel: string;
  /** For a correction: the saved check it supersedes. */
  correctsCheckId?: number;
  input: StringCheckInput;
  /** The browser's verdict when it was saved, to show on the card until the server's arrives. */
  previewVerdict: Verdict | null;
};

export type CheckQueue = OfflineQueue<QueuedCheck, StringCheck>;
export type CheckQueueEntry = QueueEntry<QueuedCheck>;

type Post = (path: string, body: unknown) => Promise<StringCheck>;

const defaultPost: Post = (path, body) => api.post(path, body, stringCheckSchema);

/** Where a queued reading goes. */
export function requestPathOf(item: QueuedCheck): string {
  return item.kind === 'revision' && item.correctsCheckId !== undefined
    ? `/api/checks/${item.correctsCheckId}/revisions`
    : `/api/work-orders/${item.workOrderId}/checks`;
}

/**
 * How a failed send is handled. No answer, 429 or 5xx: try again later (the client id makes the
 * repeat harmless). 401: wait until the person signs in again. 409, 403 and the rest: hold the reading
 * with the server's words (and the ticket's status now) until the technician retries or discards it.
 */
export function classifySendError(error: unknown): SendOutcome<StringCheck> {
  if (!isApiError(error)) return { kind: 'retry', reason: error instanceof Error ? error.message : 'The request failed.' };
  if (error.status === 0) return { kind: 'retry', reason: 'No connection: kept on this phone and sent when the connection returns.' };
  if (error.status === 429 || error.status >= 500) return { kind: 'retry', reason: `${error.message} It will be sent again shortly.` };
  if (error.status === 401) return { kind: 'stop', reason: 'Your session ended. Sign in again and the readings will be sent.' };
  if (error.code === 'BAD_RESPONSE') return { kind: 'retry', reason: error.message };
  const status = errorBodyField(error, 'status', workOrderStatusSchema);
  const reason = status ? `${error.message} The ticket is now “${workOrderStatusLabels[status]}”.` : error.message;
  return { kind: 'hold', reason, status: error.status, error };
}

export async function sendQueuedCheck(entry: CheckQueueEntry, post: Post = defaultPost): Promise<SendOutcome<StringCheck>> {
  try {
    // The entry id is the reading's clientId: the server answers a repeat with the check it already has.
    const check = await post(requestPathOf(entry.payload), { ...entry.payload.input, clientId: entry.id });
    return { kind: 'sent', result: check };
  } catch (error) {
    return classifySendError(error);
  }
}

export type CheckQueueEvent = { type: 'sent'; entry: CheckQueueEntry; check: StringCheck } | { type: 'held'; entry: CheckQueueEntry };

const idbStore: QueueStore = { get: (key) => get(key), set: (key, value) => set(key, value) };

/** A queue for one person (tests pass a memory store and a fake post). */
export function createCheckQueue(options: {
  userId: number;
  store?: QueueStore;
  post?: Post;
  onEvent?: (event: CheckQueueEvent) => void;
  isOnline?: () => boolean;
}): CheckQueue {
  return createOfflineQueue<QueuedCheck, StringCheck>({
    key: `stringfield:check-queue:${options.userId}`,
    store: options.store ?? idbStore,
    send: (entry) => sendQueuedCheck(entry, options.post),
    onSent: (entry, check) => options.onEvent?.({ type: 'sent', entry, check }),
    onHeld: (entry) => options.onEvent?.({ type: 'held', entry }),
    isOnline: options.isOnline ?? (() => navigator.onLine),
  });
}

/* One queue per signed-in person for the life of the page; events fan out to whoever listens
   (the global sync invalidates queries and announces, the field page refreshes its cards). */
const queues = new Map<number, CheckQueue>();
const eventListeners = new Set<(event: CheckQueueEvent) => void>();

export function checkQueueFor(userId: number): CheckQueue {
  let queue = queues.get(userId);
  if (!queue) {
    queue = createCheckQueue({ userId, onEvent: (event) => eventListeners.forEach((listener) => listener(event)) });
    queues.set(userId, queue);
  }
  return queue;
}

/* Readings whose form is waiting for the answer right now: the form reports those itself, so the
   background sync does not announce them a second time. */
const foreground = new Set<string>();

export function markForeground(id: string, isWaiting: boolean): void {
  if (isWaiting) foreground.add(id);
  else foreground.delete(id);
}

export function isForeground(id: string): boolean {
  return foreground.has(id);
}

export function onCheckQueueEvent(listener: (event: CheckQueueEvent) => void): () => void {
  eventListeners.add(listener);
  return () => eventListeners.delete(listener);
}
