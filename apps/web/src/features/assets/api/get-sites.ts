import { pageOf, siteSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SitesListParams } from '../lib/list-params';
import { assetKeys } from './keys';

const sitesPageSchema = pageOf(siteSchema);

/** Sites the person may see (an asset owner only their own), with string and sizing counts. */
export function getSites(params: SitesListParams, signal?: AbortSignal) {
  return api.get('/api/sites', sitesPageSchema, {
    signal,
    query: { q: params.q.trim() || undefined, sort: params.sort, page: params.page, pageSize: params.pageSize },
  });
}

export const sitesQueryOptions = (params: SitesListParams) =>
  queryOptions({
    queryKey: assetKeys.siteList(params),
    queryFn: ({ signal }) => getSites(params, signal),
    placeholderData: keepPreviousData,
  });

export function useSites(params: SitesListParams) {
  return useQuery(sitesQueryOptions(params));
}
