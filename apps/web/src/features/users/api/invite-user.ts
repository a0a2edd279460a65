import { userSchema, type InviteUserInput, type User } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { userKeys } from './keys';

/** Creates the account and e-mails an invitation to set a password. */
export function inviteUser(input: InviteUserInput): Promise<User> {
  return api.post('/api/users', input, userSchema);
}

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
