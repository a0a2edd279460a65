import { instrumentSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { fieldCheckKeys } from './keys';

const instrumentsResponseSchema = z.object({ items: z.array(instrumentSchema) });

/** The instrument register; archived instruments only when asked for. */
export async function getInstruments(includeArchived: boolean, signal?: AbortSignal) {
  const { items } = await api.get('/api/instruments', instrumentsResponseSchema, {
    signal,
    query: { includeArchived: includeArchived ? 'true' : undefined },
  });
  return items;
}

export const instrumentsQueryOptions = (includeArchived = false) =>
  queryOptions({
    queryKey: fieldCheckKeys.instrumentList(includeArchived),
    queryFn: ({ signal }) => getInstruments(includeArchived, signal),
    staleTime: 10 * 60_000,
  });

export function useInstruments(includeArchived = false) {
  return useQuery(instrumentsQueryOptions(includeArchived));
}
