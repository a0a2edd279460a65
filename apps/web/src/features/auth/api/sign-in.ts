import { meResponseSchema, type LoginInput, type SessionUser } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, clearCsrfToken } from '@/lib/api-client';
import { clearEarlyAnswers } from '@/lib/early-answers';
import { authKeys } from './keys';

export async function signIn(input: LoginInput): Promise<SessionUser> {
  const { user } = await api.post('/api/auth/login', input, meResponseSchema);
  // The session was regenerated on sign-in; its CSRF token went with the old one.
  clearCsrfToken();
  return user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Anything cached belonged to whoever was here before, answers asked for early too.
      clearEarlyAnswers();
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
