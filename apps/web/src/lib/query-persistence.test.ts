import { describe, expect, it } from 'vitest';
import { createCacheOwner, createUserScopedStorage, PERSIST_KEY, shouldPersistQuery, syncCacheOwner, type KeyValueStore } from './query-persistence';

function memoryKv(): KeyValueStore & { data: Map<string, unknown> } {
  const data = new Map<string, unknown>();
  return {
    data,
    get: (k) => Promise.resolve(data.get(k)),
    set: (k, v) => Promise.resolve(void data.set(k, v)),
    del: (k) => Promise.resolve(void data.delete(k)),
  };
}

function memoryStorage() {
  const data = new Map<string, string>();
  return { getItem: (k: string) => data.get(k) ?? null, setItem: (k: string, v: string) => void data.set(k, v), removeItem: (k: string) => void data.delete(k) };
}

describe('shouldPersistQuery', () => {
  it.each([
    [['auth', 'me'], true],
    [['work-orders', 'list', 'mine'], true],
    [['work-orders', 'detail', 16], true],
    [['field-checks', 'ticket-checks', 16], true],
    [['work-orders', 'list', { status: ['in_field'] }], false],
    [['users', 'list', {}], false],
    [['mail', 'list'], false],
  ])('%j → %s', (key, expected) => {
    expect(shouldPersistQuery(key)).toBe(expected);
  });
});

describe('user-scoped storage', () => {
  it("keeps each person's copy apart and stores nothing when nobody is signed in", async () => {
    const kv = memoryKv();
    const owner = createCacheOwner(memoryStorage());
    const storage = createUserScopedStorage(kv, owner);
    await storage.setItem(PERSIST_KEY, 'nobody');
    expect(kv.data.size).toBe(0);
    owner.set(3);
    await storage.setItem(PERSIST_KEY, 'tech');
    owner.set(2);
    expect(await storage.getItem(PERSIST_KEY)).toBeNull();
    owner.set(3);
    expect(await storage.getItem(PERSIST_KEY)).toBe('tech');
  });

  it('deletes the copy on sign-out and when another person signs in', async () => {
    const kv = memoryKv();
    const owner = createCacheOwner(memoryStorage());
    syncCacheOwner(kv, owner, 3);
    await kv.set(`${PERSIST_KEY}:3`, 'tech data');
    syncCacheOwner(kv, owner, 3);
    expect(kv.data.has(`${PERSIST_KEY}:3`)).toBe(true);
    syncCacheOwner(kv, owner, 2);
    await Promise.resolve();
    expect(kv.data.has(`${PERSIST_KEY}:3`)).toBe(false);
    expect(owner.get()).toBe('2');
    syncCacheOwner(kv, owner, null);
    expect(owner.get()).toBeNull();
  });
});
