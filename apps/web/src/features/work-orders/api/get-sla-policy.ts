import { slaPolicySchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

/** Hours to repair per priority at a site (the defaults unless an admin changed them). */
export function getSlaPolicy(siteId: number, signal?: AbortSignal) {
  return api.get(`/api/sites/${siteId}/sla`, slaPolicySchema, { signal });
}

export const slaPolicyQueryOptions = (siteId: number) =>
  queryOptions({
    queryKey: workOrderKeys.sla(siteId),
    queryFn: ({ signal }) => getSlaPolicy(siteId, signal),
  });

export function useSlaPolicy(siteId: number | undefined) {
  return useQuery({ ...slaPolicyQueryOptions(siteId ?? 0), enabled: siteId !== undefined });
}
