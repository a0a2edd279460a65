import { pageOf, pvStringSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StringsListParams } from '../lib/list-params';
import { assetKeys } from './keys';

export const stringsPageSchema = pageOf(pvStringSchema);

/** One page of a site's strings, filtered and sorted by the server. */
export function getSiteStrings(siteId: number, params: StringsListParams, signal?: AbortSignal) {
  return api.get(`/api/sites/${siteId}/strings`, stringsPageSchema, {
    signal,
    query: {
      q: params.q.trim() || undefined,
      inverterId: params.inverterId,
      mpptInput: params.mpptInput,
      sizing: params.sizing === 'all' ? undefined : params.sizing,
      sort: params.sort,
      page: params.page,
      pageSize: params.pageSize,
    },
  });
}

export const siteStringsQueryOptions = (siteId: number, params: StringsListParams) =>
  queryOptions({
    queryKey: assetKeys.siteStringList(siteId, params),
    queryFn: ({ signal }) => getSiteStrings(siteId, params, signal),
    placeholderData: keepPreviousData,
  });

export function useSiteStrings(siteId: number, params: StringsListParams) {
  return useQuery(siteStringsQueryOptions(siteId, params));
}
