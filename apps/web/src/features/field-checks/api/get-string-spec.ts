import { pvStringDetailSchema } from '@stringfield/shared';
import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { toModuleSpec, type StringSpec } from '../lib/string-spec';
import { fieldCheckKeys } from './keys';

/** What the browser needs to judge a reading as it is typed: the module datasheet and modules in series. */
export async function getStringSpec(stringId: number, signal?: AbortSignal): Promise<StringSpec> {
  const s = await api.get(`/api/strings/${stringId}`, pvStringDetailSchema, { signal });
  return {
    stringId: s.id,
    label: s.label,
    modulesInSeries: s.modulesInSeries,
    moduleName: `${s.module.maker} ${s.module.model}`,
    module: toModuleSpec(s.module),
  };
}

export const stringSpecQueryOptions = (stringId: number) =>
  answeredEarly(
    queryOptions({
      queryKey: fieldCheckKeys.stringSpec(stringId),
      queryFn: ({ signal }) => getStringSpec(stringId, signal),
      // A datasheet rarely changes during a visit.
      staleTime: 60 * 60_000,
    }),
  );

export function useStringSpec(stringId: number) {
  return useQuery(stringSpecQueryOptions(stringId));
}

/** The specs of all strings on a ticket at once, so every card is ready before the first tap (and offline). */
export function useStringSpecs(stringIds: readonly number[]) {
  return useQueries({ queries: stringIds.map((id) => stringSpecQueryOptions(id)) });
}
