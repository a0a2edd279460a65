import { meResponseSchema, type SessionUser } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
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

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    // Checked on every page load and when the window regains focus (a session can end on another
    // device: sign out everywhere, deactivation); the kept copy shows meanwhile, and carries offline use.
    staleTime: 0,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
