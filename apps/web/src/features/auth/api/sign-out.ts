import { useMutation, useQueryClient } from '@tanstack/react-query';
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
