import { pageOf, pvStringSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys, type SiteStringsParams } from './keys';

const stringsPageSchema = pageOf(pvStringSchema);

/** One page of a site's in-service strings, for picking the faulty ones. */
export function getSiteStrings(siteId: number, params: SiteStringsParams, signal?: AbortSignal) {
  return api.get(`/api/sites/${siteId}/strings`, stringsPageSchema, {
    signal,
    query: {
      q: params.q.trim() || undefined,
      sort: 'inverter',
      page: params.page,
      pageSize: params.pageSize,
    },
  });
}

export const siteStringsQueryOptions = (siteId: number, params: SiteStringsParams) =>
  queryOptions({
    queryKey: workOrderKeys.siteStrings(siteId, params),
    queryFn: ({ signal }) => getSiteStrings(siteId, params, signal),
    placeholderData: keepPreviousData,
  });

export function useSiteStrings(siteId: number | undefined, params: SiteStringsParams) {
  return useQuery({ ...siteStringsQueryOptions(siteId ?? 0, params), enabled: siteId !== undefined });
}
