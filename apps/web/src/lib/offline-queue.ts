/**
 * A first-in, first-out outbox kept on the device, for requests that must reach the server even when
 * the phone has no signal. Each entry carries its own id (the client-generated id the server uses to
 * make the request idempotent), so sending an entry twice never creates two records.
 *
 * Entries are written to storage before anything is sent, sent strictly in order, and only leave the
 * queue once the server has taken them. A network failure stops the round (later entries wait their
 * turn) and schedules the next round with exponential back-off; an answer the server will keep giving
 * (a conflict, a refusal) holds that entry with its reason until a person retries or discards it, and
 * the round carries on with the next one. Nothing here knows about HTTP: `send` says what happened.
 */

/** Where entries are kept between page loads (idb-keyval's `get`/`set` in the app, a Map in tests). */
export type QueueStore = {
  get: (key: string) => Promise<unknown>;
  set: (key: string, value: unknown) => Promise<void>;
};

export type QueueEntryState = 'pending' | 'held';

export type QueueEntry<T> = {
  /** Unique within the queue; the idempotency key sent with the request. */
  readonly id: string;
  readonly payload: T;
  /** ISO time the entry joined the queue. */
  readonly enqueuedAt: string;
  /** Failed attempts so far. */
  readonly attempts: number;
  /** `pending` waits its turn; `held` waits for a person (retry or discard). */
  readonly state: QueueEntryState;
  /** Why the last attempt failed or why the entry is held, in words for a person; null before any attempt. */
  readonly reason: string | null;
  /** HTTP status (or 0) of the answer that held the entry, for the screen to branch on. */
  readonly heldStatus: number | null;
};

/** What one attempt to send an entry came to, as judged by the caller's `send`. */
export type SendOutcome<R> =
  | { readonly kind: 'sent'; readonly result: R }
  /** Might work later (no connection, server busy): keep it pending, stop this round, back off. */
  | { readonly kind: 'retry'; readonly reason: string }
  /** Will keep failing until something changes (conflict, refused): hold it, go on with the next. */
  | { readonly kind: 'hold'; readonly reason: string; readonly status: number; readonly error?: unknown }
  /** Nothing can be sent now (the session ended): keep it pending, stop, and wait for `flush()`. */
  | { readonly kind: 'stop'; readonly reason: string };

/** What a caller waiting on one entry learns when a round has dealt with it (or stopped before it). */
export type EntryOutcome<R> =
  | { readonly kind: 'sent'; readonly result: R }
  | { readonly kind: 'held'; readonly reason: string; readonly status: number; readonly error?: unknown }
  | { readonly kind: 'waiting'; readonly reason: string };

export type QueueSnapshot<T> = {
  readonly entries: readonly QueueEntry<T>[];
  readonly isLoaded: boolean;
  readonly isFlushing: boolean;
  /** Epoch ms of the next automatic round after a failure, or null. */
  readonly nextRetryAt: number | null;
};

export type OfflineQueueOptions<T, R> = {
  /** Storage key; scope it per signed-in person. */
  key: string;
  store: QueueStore;
  send: (entry: QueueEntry<T>) => Promise<SendOutcome<R>>;
  /** Called once per entry the server took, after it left the queue. */
  onSent?: (entry: QueueEntry<T>, result: R) => void;
  /** Called when an entry becomes held. */
  onHeld?: (entry: QueueEntry<T>) => void;
  /** Whether a connection is worth trying; `navigator.onLine` in the browser. */
  isOnline?: () => boolean;
  /** First back-off delay, ms (doubles per failed round up to `maxDelayMs`). */
  baseDelayMs?: number;
  maxDelayMs?: number;
  /** Timer, injectable for tests. Returns a cancel function. */
  schedule?: (run: () => void, delayMs: number) => () => void;
  now?: () => number;
};

export type OfflineQueue<T, R> = {
  /** Resolves once the stored entries are read. */
  readonly ready: Promise<void>;
  getSnapshot: () => QueueSnapshot<T>;
  subscribe: (listener: () => void) => () => void;
  /** Stores the entry (before anything is sent). An id already queued is left as it is. */
  enqueue: (id: string, payload: T) => Promise<void>;
  /** Sends pending entries in order; resolves when the round ends. */
  flush: () => Promise<void>;
  /** Stores the entry, runs a round, and tells what became of this entry. */
  submit: (id: string, payload: T) => Promise<EntryOutcome<R>>;
  /** Puts a held entry back in line (at its original place) and runs a round. */
  retry: (id: string) => Promise<EntryOutcome<R>>;
  /** Removes an entry for good. */
  discard: (id: string) => Promise<void>;
  /** Stops the back-off timer and forgets listeners. */
  dispose: () => void;
};

/** Back-off before round `failures` (1 = first failure): base · 2^(failures−1), capped. */
export function backoffDelayMs(failures: number, baseDelayMs = 5_000, maxDelayMs = 5 * 60_000): number {
  if (failures < 1) return 0;
  return Math.min(maxDelayMs, baseDelayMs * 2 ** (failures - 1));
}

function isEntry(value: unknown): value is QueueEntry<unknown> {
  if (typeof value !== 'object' || value === null) return false;
  const v = value as Record<string, unknown>;
  return typeof v.id === 'string' && typeof v.enqueuedAt === 'string' && (v.state === 'pending' || v.state === 'held') && 'payload' in v;
}

export function createOfflineQueue<T, R>(options: OfflineQueueOptions<T, R>): OfflineQueue<T, R> {
  const {
    key,
    store,
    send,
    onSent,
    onHeld,
    isOnline = () => true,
    baseDelayMs = 5_000,
    maxDelayMs = 5 * 60_000,
    schedule = (run, delayMs) => {
      const timer = setTimeout(run, delayMs);
      return () => clearTimeout(timer);
    },
    now = () => Date.now(),
  } = options;

  let entries: QueueEntry<T>[] = [];
  let isLoaded = false;
  let isFlushing = false;
  let nextRetryAt: number | null = null;
  let failedRounds = 0;
  let cancelTimer: (() => void) | null = null;
  let running: Promise<void> | null = null;
  let again = false;
  let isDisposed = false;
  let snapshot: QueueSnapshot<T> = { entries, isLoaded, isFlushing, nextRetryAt };
  const listeners = new Set<() => void>();
  const waiters = new Map<string, Array<(outcome: EntryOutcome<R>) => void>>();

  const emit = () => {
    snapshot = { entries, isLoaded, isFlushing, nextRetryAt };
    for (const listener of listeners) listener();
  };
  // Writes are chained so a slow write can never land after a newer one.
  let writing: Promise<void> = Promise.resolve();
  const persist = () => {
    const copy = entries;
    writing = writing.then(() => store.set(key, copy)).catch(() => undefined);
    return writing;
  };
  const settle = (id: string, outcome: EntryOutcome<R>) => {
    const list = waiters.get(id);
    if (!list) return;
    waiters.delete(id);
    for (const resolve of list) resolve(outcome);
  };
  const waitFor = (id: string) =>
    new Promise<EntryOutcome<R>>((resolve) => {
      waiters.set(id, [...(waiters.get(id) ?? []), resolve]);
    });
  const replace = (id: string, change: (entry: QueueEntry<T>) => QueueEntry<T>) => {
    entries = entries.map((entry) => (entry.id === id ? change(entry) : entry));
  };

  const ready = (async () => {
    try {
      const stored = await store.get(key);
      const loaded = Array.isArray(stored) ? (stored.filter(isEntry) as QueueEntry<T>[]) : [];
      // Anything enqueued while the store was being read goes after what was already there.
      const known = new Set(loaded.map((e) => e.id));
      entries = [...loaded, ...entries.filter((e) => !known.has(e.id))];
    } catch {
      // An unreadable store starts empty rather than blocking the page.
    }
    isLoaded = true;
    emit();
  })();

  const scheduleRetry = () => {
    cancelTimer?.();
    failedRounds += 1;
    const delay = backoffDelayMs(failedRounds, baseDelayMs, maxDelayMs);
    nextRetryAt = now() + delay;
    cancelTimer = schedule(() => {
      cancelTimer = null;
      nextRetryAt = null;
      void flush();
    }, delay);
  };

  async function round(): Promise<void> {
    const tried = new Set<string>();
    for (;;) {
      const entry = entries.find((e) => e.state === 'pending' && !tried.has(e.id));
      if (!entry) break;
      tried.add(entry.id);
      if (!isOnline()) {
        settleWaiting('No connection: kept on this phone and sent when the connection returns.');
        return;
      }
      let outcome: SendOutcome<R>;
      try {
        outcome = await send(entry);
      } catch (error) {
        outcome = { kind: 'retry', reason: error instanceof Error ? error.message : 'The request failed.' };
      }
      if (isDisposed) return;
      if (outcome.kind === 'sent') {
        entries = entries.filter((e) => e.id !== entry.id);
        await persist();
        emit();
        onSent?.(entry, outcome.result);
        settle(entry.id, { kind: 'sent', result: outcome.result });
        continue;
      }
      if (outcome.kind === 'hold') {
        replace(entry.id, (e) => ({ ...e, state: 'held', attempts: e.attempts + 1, reason: outcome.reason, heldStatus: outcome.status }));
        await persist();
        emit();
        const held = entries.find((e) => e.id === entry.id);
        if (held) onHeld?.(held);
        settle(entry.id, { kind: 'held', reason: outcome.reason, status: outcome.status, error: outcome.error });
        continue;
      }
      // retry or stop: this entry and everything after it wait.
      replace(entry.id, (e) => ({ ...e, attempts: e.attempts + 1, reason: outcome.reason }));
      await persist();
      if (outcome.kind === 'retry') scheduleRetry();
      emit();
      settleWaiting(outcome.reason);
      return;
    }
    failedRounds = 0;
  }

  function settleWaiting(reason: string) {
    for (const entry of entries) if (entry.state === 'pending') settle(entry.id, { kind: 'waiting', reason });
  }

  function flush(): Promise<void> {
    if (isDisposed) return Promise.resolve();
    if (running) {
      again = true;
      return running;
    }
    cancelTimer?.();
    cancelTimer = null;
    nextRetryAt = null;
    running = (async () => {
      await ready;
      isFlushing = true;
      emit();
      try {
        do {
          again = false;
          await round();
        } while (again && !isDisposed && nextRetryAt === null);
      } finally {
        isFlushing = false;
        running = null;
        emit();
      }
    })();
    return running;
  }

  async function enqueue(id: string, payload: T): Promise<void> {
    await ready;
    if (entries.some((e) => e.id === id)) return;
    entries = [...entries, { id, payload, enqueuedAt: new Date(now()).toISOString(), attempts: 0, state: 'pending', reason: null, heldStatus: null }];
    await persist();
    emit();
  }

  async function submit(id: string, payload: T): Promise<EntryOutcome<R>> {
    await enqueue(id, payload);
    const outcome = waitFor(id);
    void flush().then(() => {
      // The round ended without reaching this entry (another round was already running and stopped).
      const entry = entries.find((e) => e.id === id);
      if (entry?.state === 'pending') settle(id, { kind: 'waiting', reason: entry.reason ?? 'Waiting to send.' });
    });
    return outcome;
  }

  async function retry(id: string): Promise<EntryOutcome<R>> {
    await ready;
    const entry = entries.find((e) => e.id === id);
    if (!entry) return { kind: 'waiting', reason: 'That reading is no longer in the queue.' };
    replace(id, (e) => ({ ...e, state: 'pending', heldStatus: null }));
    await persist();
    emit();
    const outcome = waitFor(id);
    void flush().then(() => {
      const current = entries.find((e) => e.id === id);
      if (current?.state === 'pending') settle(id, { kind: 'waiting', reason: current.reason ?? 'Waiting to send.' });
    });
    return outcome;
  }

  async function discard(id: string): Promise<void> {
    await ready;
    entries = entries.filter((e) => e.id !== id);
    await persist();
    emit();
    settle(id, { kind: 'waiting', reason: 'Discarded.' });
  }

  return {
    ready,
    getSnapshot: () => snapshot,
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    enqueue,
    flush,
    submit,
    retry,
    discard,
    dispose: () => {
      isDisposed = true;
      cancelTimer?.();
      listeners.clear();
    },
  };
}
