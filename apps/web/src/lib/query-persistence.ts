import type { QueryKey } from '@tanstack/react-query';

/**
 * Which cached answers are kept on the device between visits, and for whom. Only what a technician
 * needs without signal is written (who is signed in, My work, ticket pages, the field page's data),
 * and each person's copy is stored under their own id: a shared crew phone never shows one
 * technician's tickets to the next, and signing out removes the copy.
 */
export const PERSIST_KEY = 'stringfield:query-cache';
const OWNER_KEY = 'stringfield:query-cache-owner';
/** How long a kept copy stays usable without a visit online. */
export const PERSIST_MAX_AGE_MS = 7 * 24 * 60 * 60_000;

/** Key prefixes worth keeping offline (matched from the start of the query key). */
export const persistedKeyPrefixes: readonly QueryKey[] = [
  ['auth', 'me'],
  ['work-orders', 'list', 'mine'],
  ['work-orders', 'detail'],
  ['field-checks'],
];

export function shouldPersistQuery(queryKey: QueryKey): boolean {
  return persistedKeyPrefixes.some((prefix) => prefix.every((part, index) => queryKey[index] === part));
}

export type KeyValueStore = {
  get: (key: string) => Promise<unknown>;
  set: (key: string, value: unknown) => Promise<void>;
  del: (key: string) => Promise<void>;
};

type OwnerStore = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

/**
 * The person whose copy is restored at start-up. Kept in localStorage (synchronous), so signing out
 * forgets it before the page reloads, even if the IndexedDB delete has not finished.
 */
export function createCacheOwner(store: OwnerStore | null) {
  return {
    get: (): string | null => {
      try {
        return store?.getItem(OWNER_KEY) ?? null;
      } catch {
        return null;
      }
    },
    set: (userId: number | null) => {
      try {
        if (userId === null) store?.removeItem(OWNER_KEY);
        else store?.setItem(OWNER_KEY, String(userId));
      } catch {
        // Storage refused (private mode): nothing is kept, nothing leaks.
      }
    },
  };
}

export type CacheOwner = ReturnType<typeof createCacheOwner>;

/**
 * An AsyncStorage for the query persister that reads and writes the current owner's copy only;
 * with nobody signed in it stores nothing.
 */
export function createUserScopedStorage(kv: KeyValueStore, owner: CacheOwner) {
  const keyFor = (key: string) => {
    const id = owner.get();
    return id ? `${key}:${id}` : null;
  };
  return {
    getItem: async (key: string): Promise<string | null> => {
      const scoped = keyFor(key);
      if (!scoped) return null;
      const value = await kv.get(scoped);
      return typeof value === 'string' ? value : null;
    },
    setItem: async (key: string, value: string): Promise<void> => {
      const scoped = keyFor(key);
      if (scoped) await kv.set(scoped, value);
    },
    removeItem: async (key: string): Promise<void> => {
      const scoped = keyFor(key);
      if (scoped) await kv.del(scoped);
    },
  };
}

/**
 * Keeps the owner in step with the session: a signed-in person becomes the owner (a different
 * person's copy is deleted first); signing out or losing the session deletes the copy.
 */
export function syncCacheOwner(kv: KeyValueStore, owner: CacheOwner, userId: number | null): void {
  const current = owner.get();
  if (userId !== null && current === String(userId)) return;
  if (current !== null) void kv.del(`${PERSIST_KEY}:${current}`).catch(() => undefined);
  owner.set(userId);
}
