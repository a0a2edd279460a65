import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { onlineManager, type QueryClient } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { del, get, set } from 'idb-keyval';
import { lazy, Suspense, useEffect, useState, type ReactNode } from 'react';
import type { SessionUser } from '@stringfield/shared';
import { authKeys } from '@/features/auth/api/keys';
import type * as ToasterModule from '@/components/ui/app-toaster';
import { afterPageSettles } from '@/lib/after-load';
import { clearEarlyAnswers } from '@/lib/early-answers';
import { createQueryClient } from '@/lib/query-client';
import {
  createCacheOwner,
  createUserScopedStorage,
  persistedKeyPrefixes,
  PERSIST_KEY,
  PERSIST_MAX_AGE_MS,
  shouldPersistQuery,
  syncCacheOwner,
  type KeyValueStore,
} from '@/lib/query-persistence';

// Toasts only follow something a person did; the toaster (and Sonner) download and mount once the first
// page has settled, so that on a slow connection they do not compete with its code and data (a toast asked
// for before then waits for it, see lib/toast.ts). Once the service worker holds the app, they come from
// the phone.
const RETRY_TOASTER_MS = 15_000;

/**
 * The toaster's code. A download that fails (no signal on a first visit, before the service worker holds
 * the app) is tried again when the phone is back online or a while later, never an error on screen;
 * toasts asked for meanwhile wait and show then.
 */
function importToaster(): Promise<typeof ToasterModule> {
  return import('@/components/ui/app-toaster').catch(
    () =>
      new Promise<typeof ToasterModule>((resolve) => {
        const again = () => {
          clearTimeout(timer);
          window.removeEventListener('online', again);
          resolve(importToaster());
        };
        const timer = setTimeout(again, RETRY_TOASTER_MS);
        window.addEventListener('online', again);
      }),
  );
}
const AppToaster = lazy(async () => ({ default: (await importToaster()).AppToaster }));

const idb: KeyValueStore = { get: (key) => get(key), set: (key, value) => set(key, value), del: (key) => del(key) };
const cacheOwner = createCacheOwner(typeof window === 'undefined' ? null : window.localStorage);

/**
 * Keeps what a technician needs offline (see lib/query-persistence) on the device, per person: the
 * copy follows the signed-in person and is deleted on sign-out (the cache is cleared) or a lost session.
 */
function setUpPersistence(client: QueryClient) {
  // Kept queries must outlive the persisted copy, or they would be dropped before being written.
  for (const prefix of persistedKeyPrefixes) client.setQueryDefaults(prefix, { gcTime: PERSIST_MAX_AGE_MS });
  // TanStack assumes "online" until an event says otherwise; a phone that starts without signal should pause, not fail.
  if (typeof navigator !== 'undefined') onlineManager.setOnline(navigator.onLine);
  client.getQueryCache().subscribe((event) => {
    const key = event.query.queryKey as readonly unknown[];
    if (key[0] !== authKeys.all[0] || key[1] !== authKeys.me()[1]) return;
    if (event.type === 'removed') syncCacheOwner(idb, cacheOwner, null);
    else if (event.type === 'updated' && event.action.type === 'success') {
      const user = event.query.state.data as SessionUser | null | undefined;
      syncCacheOwner(idb, cacheOwner, user ? user.id : null);
    }
  });
  return createAsyncStoragePersister({ storage: createUserScopedStorage(idb, cacheOwner), key: PERSIST_KEY, throttleTime: 1000 });
}

/** Everything the app runs inside: the query cache and the toast outlet. */
export function AppProvider({ children }: { children: ReactNode }) {
  const [{ queryClient, persister }] = useState(() => {
    const client = createQueryClient({
      // Any 401 means the session is gone (expired, or an administrator ended it): forget the person,
      // and the protected layout sends them to sign in with a way back.
      onUnauthenticated: () => {
        clearEarlyAnswers();
        client.setQueryData(authKeys.me(), null);
      },
    });
    return { queryClient: client, persister: setUpPersistence(client) };
  });
  const [hasToaster, setHasToaster] = useState(false);
  useEffect(() => afterPageSettles(() => setHasToaster(true), 1_000), []);

  return (
    <PersistQueryClientProvider
      client={queryClient}
      persistOptions={{
        persister,
        maxAge: PERSIST_MAX_AGE_MS,
        // A new release may change the shape of answers: start from a clean copy.
        buster: 'stringfield-1',
        dehydrateOptions: { shouldDehydrateQuery: (query) => query.state.status === 'success' && shouldPersistQuery(query.queryKey) },
      }}
    >
      {children}
      {hasToaster ? (
        <Suspense fallback={null}>
          <AppToaster />
        </Suspense>
      ) : null}
    </PersistQueryClientProvider>
  );
}
