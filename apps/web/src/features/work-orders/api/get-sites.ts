import { pageOf, siteSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { workOrderKeys } from './keys';

const sitesPageSchema = pageOf(siteSchema);

/** Every site the person may see, for the site pickers of the board, the new-ticket form and SLA settings. */
export function getSiteOptions(signal?: AbortSignal) {
  return api.get('/api/sites', sitesPageSchema, { signal, query: { pageSize: 200, sort: 'name' } });
}

export const siteOptionsQueryOptions = () =>
  answeredEarly(
    queryOptions({
      queryKey: workOrderKeys.sites(),
      queryFn: ({ signal }) => getSiteOptions(signal),
      select: (data) => data.items.filter((site) => !site.isArchived),
      staleTime: 5 * 60_000,
    }),
  );

export function useSiteOptions() {
  return useQuery(siteOptionsQueryOptions());
}
