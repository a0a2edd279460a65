import { pageOf, userSchema } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { UsersListParams } from '../lib/list-params';
import { userKeys } from './keys';

const usersPageSchema = pageOf(userSchema);

export function getUsers(params: UsersListParams, signal?: AbortSignal) {
  return api.get('/api/users', usersPageSchema, {
    signal,
    query: {
      q: params.q.trim() || undefined,
      role: params.role,
      status: params.status,
      sort: params.sort,
      page: params.page,
      pageSize: params.pageSize,
    },
  });
}

export const usersQueryOptions = (params: UsersListParams) =>
  queryOptions({
    queryKey: userKeys.list(params),
    queryFn: ({ signal }) => getUsers(params, signal),
    // Keep the previous page on screen while the next one loads, instead of flashing skeletons.
    placeholderData: keepPreviousData,
  });

export function useUsers(params: UsersListParams) {
  return useQuery(usersQueryOptions(params));
}
