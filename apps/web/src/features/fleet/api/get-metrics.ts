import { metricsSchema, type MetricsQuery } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fleetKeys } from './keys';

/** Work-order metrics for tickets reported in the period (open counts: as of now). */
export function getMetrics(query: MetricsQuery, signal?: AbortSignal) {
  return api.get('/api/fleet/metrics', metricsSchema, {
    signal,
    query: { from: query.from, to: query.to, siteId: query.siteId, faultCategory: query.faultCategory },
  });
}

export const metricsQueryOptions = (query: MetricsQuery) =>
  queryOptions({
    queryKey: fleetKeys.metricsFor(query),
    queryFn: ({ signal }) => getMetrics(query, signal),
    // Keep the last figures on screen while a new period loads, instead of flashing skeletons.
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export function useMetrics(query: MetricsQuery) {
  return useQuery(metricsQueryOptions(query));
}
