import { pageOf, siteSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fleetKeys } from './keys';

const sitesPageSchema = pageOf(siteSchema);

/** Every site the person may see (an owner: theirs), for the fleet's site pickers: one page of up to 200. */
export function getFleetSites(signal?: AbortSignal) {
  return api.get('/api/sites', sitesPageSchema, { signal, query: { sort: 'name', page: 1, pageSize: 200 } });
}

export const fleetSitesQueryOptions = () =>
  queryOptions({
    queryKey: fleetKeys.sites(),
    queryFn: ({ signal }) => getFleetSites(signal),
    select: (page) => page.items,
    staleTime: 5 * 60_000,
  });

export function useFleetSites() {
  return useQuery(fleetSitesQueryOptions());
}
