import { healthMapSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fleetKeys } from './keys';

/** Every string of a site with its latest verdict and open tickets, in one answer (thousands of rows on a big plant). */
export function getHealthMap(siteId: number, signal?: AbortSignal) {
  return api.get(`/api/fleet/sites/${siteId}/health-map`, healthMapSchema, { signal });
}

export const healthMapQueryOptions = (siteId: number) =>
  queryOptions({
    queryKey: fleetKeys.healthMap(siteId),
    queryFn: ({ signal }) => getHealthMap(siteId, signal),
    // Checks arrive a few a minute at most; a minute old is fresh enough for a wall screen.
    staleTime: 60_000,
  });

export function useHealthMap(siteId: number) {
  return useQuery(healthMapQueryOptions(siteId));
}
