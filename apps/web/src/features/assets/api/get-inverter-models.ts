import { pageOf, inverterModelSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LibraryListParams } from '../lib/list-params';
import { assetKeys } from './keys';

const pageSchema = pageOf(inverterModelSchema);

export function getInverterModels(params: LibraryListParams, signal?: AbortSignal) {
  return api.get('/api/inverter-models', pageSchema, {
    signal,
    query: {
      q: params.q.trim() || undefined,
      includeArchived: params.includeArchived ? 'true' : undefined,
      page: params.page,
      pageSize: params.pageSize,
    },
  });
}

export const inverterModelsQueryOptions = (params: LibraryListParams) =>
  queryOptions({
    queryKey: assetKeys.inverterModelList(params),
    queryFn: ({ signal }) => getInverterModels(params, signal),
    placeholderData: keepPreviousData,
  });

export function useInverterModels(params: LibraryListParams) {
  return useQuery(inverterModelsQueryOptions(params));
}
