import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

/** Retry only what might succeed on a second try: no answer at all, or a 5xx/429 from the server. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (failureCount >= 2) return false;
  if (!isApiError(error)) return false;
  return error.status === 0 || error.status === 429 || error.status >= 500;
}

/**
 * One QueryClient per app. `onUnauthenticated` runs when any call answers 401 (the session expired or
 * was ended by an administrator), so the app can send the person back to sign in.
 */
export function createQueryClient(options: { onUnauthenticated?: () => void } = {}): QueryClient {
  const onError = (error: unknown) => {
    if (isApiError(error) && error.status === 401) options.onUnauthenticated?.();
  };
  return new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: shouldRetry,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
}
