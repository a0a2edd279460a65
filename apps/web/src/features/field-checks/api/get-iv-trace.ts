import { ivTraceSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fieldCheckKeys } from './keys';

/** The I-V trace attached to a check, with the server's analysis and its STC translation. */
export function getIvTrace(checkId: number, signal?: AbortSignal) {
  return api.get(`/api/checks/${checkId}/iv-trace`, ivTraceSchema, { signal });
}

export const ivTraceQueryOptions = (checkId: number) =>
  queryOptions({
    queryKey: fieldCheckKeys.ivTrace(checkId),
    queryFn: ({ signal }) => getIvTrace(checkId, signal),
    staleTime: Infinity,
  });

export function useIvTrace(checkId: number, options: { enabled: boolean }) {
  return useQuery({ ...ivTraceQueryOptions(checkId), enabled: options.enabled });
}
