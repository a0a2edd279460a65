import { workOrderDetailSchema, type CreateWorkOrderInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

const createdSchema = z.object({ items: z.array(workOrderDetailSchema) });

/** Opens one ticket for all the strings, or one per string (`mode: 'perString'`). */
export function createWorkOrder(input: CreateWorkOrderInput) {
  return api.post('/api/work-orders', input, createdSchema);
}

export function useCreateWorkOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWorkOrder,
    onSuccess: ({ items }) => {
      for (const item of items) queryClient.setQueryData(workOrderKeys.detail(item.id), item);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: workOrderKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: workOrderKeys.technicians() }),
      ]);
    },
  });
}
