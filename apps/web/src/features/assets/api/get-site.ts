import { siteSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

export function getSite(siteId: number, signal?: AbortSignal) {
  return api.get(`/api/sites/${siteId}`, siteSchema, { signal });
}

export const siteQueryOptions = (siteId: number) =>
  queryOptions({ queryKey: assetKeys.site(siteId), queryFn: ({ signal }) => getSite(siteId, signal) });

export function useSite(siteId: number) {
  return useQuery(siteQueryOptions(siteId));
}
