import { workOrderDetailSchema, type UpdateWorkOrderInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

/** Changes title, description, priority, fault category or due time, only if `version` is still current. */
export function updateWorkOrder({ id, input }: { id: number; input: UpdateWorkOrderInput }) {
  return api.patch(`/api/work-orders/${id}`, input, workOrderDetailSchema);
}

export function useUpdateWorkOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateWorkOrder,
    onSuccess: (detail) => {
      queryClient.setQueryData(workOrderKeys.detail(detail.id), detail);
      return queryClient.invalidateQueries({ queryKey: workOrderKeys.lists() });
    },
  });
}
