import { workOrderDetailSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { workOrderKeys } from './keys';

/** One ticket with its strings, history and the transitions the signed-in person may take now. */
export function getWorkOrder(id: number, signal?: AbortSignal) {
  return api.get(`/api/work-orders/${id}`, workOrderDetailSchema, { signal });
}

export const workOrderQueryOptions = (id: number) =>
  answeredEarly(
    queryOptions({
      queryKey: workOrderKeys.detail(id),
      queryFn: ({ signal }) => getWorkOrder(id, signal),
    }),
  );

export function useWorkOrder(id: number) {
  return useQuery(workOrderQueryOptions(id));
}
