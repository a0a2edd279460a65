import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api, clearCsrfToken } from '@/lib/api-client';
import { paths } from '@/config/paths';

export async function signOut(): Promise<void> {
  await api.post('/api/auth/logout');
}

/**
 * Signs out, then reloads into the sign-in page: crew phones and site-office PCs are shared, so
 * nothing of the last person's data may stay in memory.
 */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      clearCsrfToken();
      queryClient.clear();
      window.location.replace(paths.signIn());
    },
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
    onSuccess: () => {
      clearCsrfToken();
      queryClient.clear();
      window.location.replace(paths.signIn());
    },
  });
}
