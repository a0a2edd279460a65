import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { diodeReplacementsResponseSchema } from './get-diode-replacements';
import { evidenceKeys } from './keys';

/** A string's diode history across tickets (owners: signed-off tickets only). */
export function getStringDiodeReplacements(stringId: number, signal?: AbortSignal) {
  return api.get('/api/diode-replacements', diodeReplacementsResponseSchema, { signal, query: { stringId } }).then((r) => r.items);
}

export const stringDiodeReplacementsQueryOptions = (stringId: number) =>
  queryOptions({
    queryKey: evidenceKeys.stringDiodes(stringId),
    queryFn: ({ signal }) => getStringDiodeReplacements(stringId, signal),
  });

export function useStringDiodeReplacements(stringId: number) {
  return useQuery(stringDiodeReplacementsQueryOptions(stringId));
}
