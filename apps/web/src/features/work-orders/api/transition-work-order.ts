import { workOrderDetailSchema, type TransitionInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

/**
 * Moves a ticket along its lifecycle. `version` is the one the person saw: if someone else changed the
 * ticket since, the API answers 409 with the fresh ticket (see `conflictCurrent`).
 */
export function transitionWorkOrder({ id, input }: { id: number; input: TransitionInput }) {
  return api.post(`/api/work-orders/${id}/transitions`, input, workOrderDetailSchema);
}

export function useTransitionWorkOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: transitionWorkOrder,
    onSuccess: (detail) => {
      queryClient.setQueryData(workOrderKeys.detail(detail.id), detail);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: workOrderKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: workOrderKeys.technicians() }),
      ]);
    },
  });
}
