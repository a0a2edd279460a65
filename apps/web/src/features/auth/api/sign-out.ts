import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api, clearCsrfToken } from '@/lib/api-client';
import { clearEarlyAnswers } from '@/lib/early-answers';
import { paths } from '@/config/paths';
import { authKeys } from './keys';

export async function signOut(): Promise<void> {
  await api.post('/api/auth/logout');
}

/**
 * Forgets everything of the person who signed out, then reloads into the sign-in page. The session
 * is set to nobody before the cache is cleared: clear() alone drops the answers without telling the
 * components that show them, so the person's frame and page would stay on screen until the sign-in
 * page arrives (seconds on a slow connection); told, the protected layout swaps them for the loading
 * frame at once.
 */
function forgetPerson(queryClient: QueryClient) {
  clearCsrfToken();
  clearEarlyAnswers();
  queryClient.setQueryData(authKeys.me(), null);
  queryClient.clear();
  // The sign-in page is asked for once the loading frame has been drawn: the query cache tells the
  // components in a task of its own, and on a busy phone the next page could otherwise arrive first, with
  // the person's page still what was on screen. (A hidden tab draws no frames: then after half a second.)
  let isGone = false;
  const go = () => {
    if (isGone) return;
    isGone = true;
    window.location.replace(paths.signIn());
  };
  requestAnimationFrame(() => setTimeout(go, 0));
  setTimeout(go, 500);
}

/**
 * Signs out, then reloads into the sign-in page: crew phones and site-office PCs are shared, so
 * nothing of the last person's data may stay in memory, nor on screen.
 */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => forgetPerson(queryClient),
  });
}

const endedSchema = z.object({ ended: z.number() });

export async function signOutEverywhere(): Promise<{ ended: number }> {
  return api.post('/api/auth/sign-out-everywhere', undefined, endedSchema);
}

/** Ends every session of this person (a lost phone, a shared PC left signed in), this one too. */
export function useSignOutEverywhere() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOutEverywhere,
    onSuccess: () => forgetPerson(queryClient),
  });
}
