import { inverterSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

const invertersSchema = z.array(inverterSchema);

/** The site's inverters with their MPPT input count and string count (not paged: a site has tens). */
export function getInverters(siteId: number, signal?: AbortSignal) {
  return api.get('/api/inverters', invertersSchema, { signal, query: { siteId } });
}

export const invertersQueryOptions = (siteId: number) =>
  queryOptions({ queryKey: assetKeys.inverters(siteId), queryFn: ({ signal }) => getInverters(siteId, signal) });

export function useInverters(siteId: number) {
  return useQuery(invertersQueryOptions(siteId));
}
