import { gatesResponseSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { signOffKeys } from './keys';

/** The evidence gates of sign-off, each with what is still missing. */
export function getGates(workOrderId: number, signal?: AbortSignal) {
  return api.get(`/api/work-orders/${workOrderId}/sign-off-gates`, gatesResponseSchema, { signal });
}

export const gatesQueryOptions = (workOrderId: number) =>
  queryOptions({
    queryKey: signOffKeys.gates(workOrderId),
    queryFn: ({ signal }) => getGates(workOrderId, signal),
    // Evidence arrives from the field while the supervisor looks; refresh when they come back to the tab.
    refetchOnWindowFocus: true,
  });

export function useGates(workOrderId: number, options: { isEnabled?: boolean } = {}) {
  return useQuery({ ...gatesQueryOptions(workOrderId), enabled: options.isEnabled ?? true });
}
