import { describe, expect, it } from 'vitest';
import { backoffDelayMs, createOfflineQueue, type QueueStore, type SendOutcome } from './offline-queue';

function memoryStore(initial: Record<string, unknown> = {}): QueueStore & { data: Map<string, unknown> } {
  const data = new Map(Object.entries(initial));
  return {
    data,
    get: (key) => Promise.resolve(structuredClone(data.get(key))),
    set: (key, value) => {
      data.set(key, structuredClone(value));
      return Promise.resolve();
    },
  };
}

/** A fake server: answers each id with the next scripted outcome, and records the order of calls. */
function fakeTransport(script: Record<string, Array<SendOutcome<string>>> = {}) {
  const calls: string[] = [];
  const taken = new Set<string>();
  const send = (entry: { id: string }): Promise<SendOutcome<string>> => {
    calls.push(entry.id);
    const next = script[entry.id]?.shift();
    if (next) return Promise.resolve(next);
    // Idempotent like the API: a second send of the same id is still one record.
    taken.add(entry.id);
    return Promise.resolve({ kind: 'sent', result: `saved ${entry.id}` });
  };
  return { send, calls, taken };
}

function manualTimers() {
  const pending: Array<{ run: () => void; delayMs: number }> = [];
  return {
    pending,
    schedule: (run: () => void, delayMs: number) => {
      const item = { run, delayMs };
      pending.push(item);
      return () => {
        const i = pending.indexOf(item);
        if (i >= 0) pending.splice(i, 1);
      };
    },
    fireNext: () => pending.shift()?.run(),
  };
}

const network = { kind: 'retry', reason: 'No connection' } as const;

describe('createOfflineQueue', () => {
  it('sends readings in the order they were taken and empties the queue', async () => {
    const store = memoryStore();
    const server = fakeTransport();
    const queue = createOfflineQueue({ key: 'q', store, send: server.send });
    await queue.enqueue('a', 1);
    await queue.enqueue('b', 2);
    await queue.enqueue('c', 3);
    await queue.flush();
    expect(server.calls).toEqual(['a', 'b', 'c']);
    expect(queue.getSnapshot().entries).toEqual([]);
    expect(store.data.get('q')).toEqual([]);
  });

  it('writes an entry to the store before it is sent, so closing the page loses nothing', async () => {
    const store = memoryStore();
    let seenInStore: unknown;
    const queue = createOfflineQueue<number, string>({
      key: 'q',
      store,
      send: () => {
        seenInStore = store.data.get('q');
        return Promise.resolve(network);
      },
      schedule: () => () => undefined,
    });
    await queue.submit('a', 42);
    expect(seenInStore).toMatchObject([{ id: 'a', payload: 42, state: 'pending' }]);
  });

  it('stops at a network failure, keeps the order, and backs off 5 s, 10 s, 20 s', async () => {
    const timers = manualTimers();
    const server = fakeTransport({ a: [network, network, network] });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send, schedule: timers.schedule });
    await queue.enqueue('a', 1);
    await queue.enqueue('b', 2);
    await queue.flush();
    expect(server.calls).toEqual(['a']);
    expect(queue.getSnapshot().entries.map((e) => [e.id, e.attempts])).toEqual([
      ['a', 1],
      ['b', 0],
    ]);
    expect(timers.pending.map((t) => t.delayMs)).toEqual([5_000]);
    timers.fireNext();
    await queue.flush();
    expect(timers.pending.map((t) => t.delayMs)).toEqual([10_000]);
    timers.fireNext();
    await queue.flush();
    expect(timers.pending.map((t) => t.delayMs)).toEqual([20_000]);
    timers.fireNext();
    await queue.flush();
    expect(server.calls).toEqual(['a', 'a', 'a', 'a', 'b']);
    expect(queue.getSnapshot().entries).toEqual([]);
    expect(timers.pending).toEqual([]);
  });

  it('holds a conflicting reading with its reason and still sends the ones after it', async () => {
    const server = fakeTransport({
      a: [{ kind: 'hold', reason: 'WO-2026-00016 was returned meanwhile', status: 409 }],
    });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send });
    await queue.enqueue('a', 1);
    await queue.enqueue('b', 2);
    await queue.flush();
    expect(server.calls).toEqual(['a', 'b']);
    expect(queue.getSnapshot().entries).toMatchObject([{ id: 'a', state: 'held', heldStatus: 409, reason: 'WO-2026-00016 was returned meanwhile' }]);
    // A held entry is not resent automatically.
    await queue.flush();
    expect(server.calls).toEqual(['a', 'b']);
  });

  it('resends a held reading on Retry and removes it on Discard', async () => {
    const server = fakeTransport({ a: [{ kind: 'hold', reason: 'Returned', status: 409 }], b: [{ kind: 'hold', reason: 'Forbidden', status: 403 }] });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send });
    await queue.enqueue('a', 1);
    await queue.enqueue('b', 2);
    await queue.flush();
    expect(await queue.retry('a')).toEqual({ kind: 'sent', result: 'saved a' });
    await queue.discard('b');
    expect(queue.getSnapshot().entries).toEqual([]);
  });

  it('tells the form what became of its own reading', async () => {
    const server = fakeTransport({ b: [{ kind: 'hold', reason: 'Returned', status: 409 }] });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send });
    expect(await queue.submit('a', 1)).toEqual({ kind: 'sent', result: 'saved a' });
    expect(await queue.submit('b', 2)).toMatchObject({ kind: 'held', status: 409, reason: 'Returned' });
  });

  it('reports "waiting" to a reading queued behind one that cannot be sent yet', async () => {
    const server = fakeTransport({ a: [network] });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send, schedule: () => () => undefined });
    await queue.enqueue('a', 1);
    expect(await queue.submit('b', 2)).toEqual({ kind: 'waiting', reason: 'No connection' });
    expect(server.calls).toEqual(['a']);
  });

  it('sends nothing while the device is offline', async () => {
    let online = false;
    const server = fakeTransport();
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send, isOnline: () => online });
    expect((await queue.submit('a', 1)).kind).toBe('waiting');
    expect(server.calls).toEqual([]);
    online = true;
    await queue.flush();
    expect(server.calls).toEqual(['a']);
  });

  it('never queues the same client id twice, so a double tap is one check', async () => {
    const server = fakeTransport({ a: [network] });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send, schedule: () => () => undefined });
    await queue.enqueue('a', 1);
    await queue.enqueue('a', 1);
    expect(queue.getSnapshot().entries).toHaveLength(1);
  });

  it('picks up what an earlier page load left in the store, ahead of new readings', async () => {
    const store = memoryStore({
      q: [{ id: 'old', payload: 0, enqueuedAt: '2026-12-01T10:00:00.000Z', attempts: 2, state: 'pending', reason: 'No connection', heldStatus: null }],
    });
    const server = fakeTransport();
    const queue = createOfflineQueue({ key: 'q', store, send: server.send });
    await queue.enqueue('new', 1);
    await queue.flush();
    expect(server.calls).toEqual(['old', 'new']);
  });

  it('keeps entries pending without backing off when the session has ended', async () => {
    const timers = manualTimers();
    const server = fakeTransport({ a: [{ kind: 'stop', reason: 'Sign in again to send' }] });
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: server.send, schedule: timers.schedule });
    await queue.enqueue('a', 1);
    await queue.flush();
    expect(queue.getSnapshot().entries).toMatchObject([{ id: 'a', state: 'pending', reason: 'Sign in again to send' }]);
    expect(timers.pending).toEqual([]);
  });

  it('treats a transport that throws as a network failure', async () => {
    const queue = createOfflineQueue<number, string>({
      key: 'q',
      store: memoryStore(),
      send: () => Promise.reject(new Error('socket hang up')),
      schedule: () => () => undefined,
    });
    expect(await queue.submit('a', 1)).toEqual({ kind: 'waiting', reason: 'socket hang up' });
  });

  it('notifies subscribers as the queue changes', async () => {
    const queue = createOfflineQueue({ key: 'q', store: memoryStore(), send: fakeTransport().send });
    const counts: number[] = [];
    queue.subscribe(() => counts.push(queue.getSnapshot().entries.length));
    await queue.enqueue('a', 1);
    await queue.flush();
    expect(counts).toContain(1);
    expect(counts.at(-1)).toBe(0);
  });
});

describe('backoffDelayMs', () => {
  it.each([
    [1, 5_000],
    [2, 10_000],
    [3, 20_000],
    [7, 300_000],
    [20, 300_000],
  ])('waits %i failed rounds → %i ms', (failures, delay) => {
    expect(backoffDelayMs(failures)).toBe(delay);
  });
});
