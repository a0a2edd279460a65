import { pvStringDetailSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

/** A string with its site, module and inverter datasheets and the server's named sizing checks. */
export function getString(stringId: number, signal?: AbortSignal) {
  return api.get(`/api/strings/${stringId}`, pvStringDetailSchema, { signal });
}

export const stringQueryOptions = (stringId: number) =>
  queryOptions({ queryKey: assetKeys.string(stringId), queryFn: ({ signal }) => getString(stringId, signal) });

export function useString(stringId: number) {
  return useQuery(stringQueryOptions(stringId));
}
