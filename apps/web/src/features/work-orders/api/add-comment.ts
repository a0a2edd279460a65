import { workOrderEventSchema } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

/** Adds a comment to the ticket's timeline; `@name` mentions are resolved by the server. */
export function addComment({ id, body }: { id: number; body: string }) {
  return api.post(`/api/work-orders/${id}/comments`, { body }, workOrderEventSchema);
}

export function useAddComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addComment,
    onSuccess: (_event, { id }) => queryClient.invalidateQueries({ queryKey: workOrderKeys.detail(id) }),
  });
}
