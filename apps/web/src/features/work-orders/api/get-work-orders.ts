import { pageOf, workOrderListItemSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { workOrderListQuery, type WorkOrderListParams } from '../lib/list-params';
import { workOrderKeys } from './keys';

export const workOrdersPageSchema = pageOf(workOrderListItemSchema);

/** One page of the board, filtered and sorted by the server (owners: their signed-off tickets only). */
export function getWorkOrders(params: WorkOrderListParams, signal?: AbortSignal) {
  return api.get('/api/work-orders', workOrdersPageSchema, { signal, query: workOrderListQuery(params) });
}

export const workOrdersQueryOptions = (params: WorkOrderListParams) =>
  answeredEarly(
    queryOptions({
      queryKey: workOrderKeys.list(params),
      queryFn: ({ signal }) => getWorkOrders(params, signal),
      // Keep the previous page on screen while the next one loads, instead of flashing skeletons.
      placeholderData: keepPreviousData,
      // A board on a wall screen stays current without a reload.
      refetchInterval: 60_000,
    }),
  );

export function useWorkOrders(params: WorkOrderListParams) {
  return useQuery(workOrdersQueryOptions(params));
}
