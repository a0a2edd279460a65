import { userSchema, type UpdateUserInput, type User } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { userKeys } from './keys';

/** Changes name, role or access; deactivating also ends every session of that person on the server. */
export function updateUser({ id, changes }: { id: number; changes: UpdateUserInput }): Promise<User> {
  return api.patch(`/api/users/${id}`, changes, userSchema);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
