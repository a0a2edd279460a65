import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { workOrdersPageSchema } from './get-work-orders';
import { workOrderKeys } from './keys';

/** The signed-in technician's open tickets, all of them (a crew member rarely holds more than a few dozen). */
export function getMyWorkOrders(signal?: AbortSignal) {
  return api.get('/api/work-orders', workOrdersPageSchema, {
    signal,
    query: { assigneeId: 'me', open: 'true', sort: 'dueAt', pageSize: 200 },
  });
}

export const myWorkOrdersQueryOptions = () =>
  answeredEarly(
    queryOptions({
      queryKey: workOrderKeys.mine(),
      queryFn: ({ signal }) => getMyWorkOrders(signal),
      refetchInterval: 60_000,
    }),
  );

export function useMyWorkOrders() {
  return useQuery(myWorkOrdersQueryOptions());
}
