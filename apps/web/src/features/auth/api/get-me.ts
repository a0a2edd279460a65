import { meResponseSchema, type SessionUser } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { answeredEarly, startEarly } from '@/lib/early-answers';
import { authKeys } from './keys';

/** The signed-in person, or null when nobody is signed in (401 is an answer here, not an error). */
export async function getMe(signal?: AbortSignal): Promise<SessionUser | null> {
  try {
    const { user } = await api.get('/api/auth/me', meResponseSchema, { signal });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

/**
 * Asks who is signed in before React renders, so the answer travels alongside the page's code and the
 * restore of the kept copy instead of after them; the first `me` query takes it over.
 */
export function startMeEarly(): void {
  startEarly(authKeys.me(), () => getMe());
}

export const meQueryOptions = () =>
  answeredEarly(
    queryOptions({
      queryKey: authKeys.me(),
      queryFn: ({ signal }) => getMe(signal),
      // Checked on every page load and when the window regains focus (a session can end on another
      // device: sign out everywhere, deactivation); the kept copy shows meanwhile, and carries offline use.
      staleTime: 0,
    }),
  );

export function useMe() {
  return useQuery(meQueryOptions());
}
