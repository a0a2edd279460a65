import { pageOf, moduleModelSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LibraryListParams } from '../lib/list-params';
import { assetKeys } from './keys';

const pageSchema = pageOf(moduleModelSchema);

export function getModuleModels(params: LibraryListParams, signal?: AbortSignal) {
  return api.get('/api/module-models', pageSchema, {
    signal,
    query: {
      q: params.q.trim() || undefined,
      includeArchived: params.includeArchived ? 'true' : undefined,
      page: params.page,
      pageSize: params.pageSize,
    },
  });
}

export const moduleModelsQueryOptions = (params: LibraryListParams) =>
  queryOptions({
    queryKey: assetKeys.moduleModelList(params),
    queryFn: ({ signal }) => getModuleModels(params, signal),
    placeholderData: keepPreviousData,
  });

export function useModuleModels(params: LibraryListParams) {
  return useQuery(moduleModelsQueryOptions(params));
}
