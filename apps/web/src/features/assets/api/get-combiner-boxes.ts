import { combinerBoxSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

const combinerBoxesSchema = z.array(combinerBoxSchema);

export function getCombinerBoxes(siteId: number, signal?: AbortSignal) {
  return api.get('/api/combiner-boxes', combinerBoxesSchema, { signal, query: { siteId } });
}

export const combinerBoxesQueryOptions = (siteId: number) =>
  queryOptions({ queryKey: assetKeys.combinerBoxes(siteId), queryFn: ({ signal }) => getCombinerBoxes(siteId, signal) });

export function useCombinerBoxes(siteId: number) {
  return useQuery(combinerBoxesQueryOptions(siteId));
}
