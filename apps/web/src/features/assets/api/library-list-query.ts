import { pageOf } from '@stringfield/shared';
import { keepPreviousData, queryOptions, type QueryKey } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { LibraryListParams } from '../lib/list-params';

/**
 * The list endpoint of a datasheet library (`GET /api/<kind>-models`): one page of datasheets,
 * searched by maker or model, archived ones only on request. Each endpoint file builds its fetcher
 * and query options from this and adds its own hook.
 */
export function libraryListQuery<S extends z.ZodType, K extends QueryKey>(path: string, itemSchema: S, listKey: (params: LibraryListParams) => K) {
  const pageSchema = pageOf(itemSchema);

  const fetchPage = (params: LibraryListParams, signal?: AbortSignal) =>
    api.get(path, pageSchema, {
      signal,
      query: {
        q: params.q.trim() || undefined,
        includeArchived: params.includeArchived ? 'true' : undefined,
        page: params.page,
        pageSize: params.pageSize,
      },
    });

  const options = (params: LibraryListParams) =>
    queryOptions({
      queryKey: listKey(params),
      queryFn: ({ signal }) => fetchPage(params, signal),
      placeholderData: keepPreviousData,
    });

  return { fetchPage, options };
}
