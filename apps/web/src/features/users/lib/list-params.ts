import { pageQuerySchema, userListQuerySchema, type Role } from '@stringfield/shared';
import type { SortingState } from '@tanstack/react-table';

export type UserStatusFilter = 'active' | 'inactive' | 'all';
export type UserSort = 'name' | '-name' | 'email' | '-email' | 'role' | '-role' | 'createdAt' | '-createdAt';

/** The People list as the URL describes it: what `GET /api/users` is asked for. */
export type UsersListParams = {
  q: string;
  role: Role | undefined;
  status: UserStatusFilter;
  sort: UserSort;
  page: number;
  pageSize: number;
};

export const defaultUsersListParams: UsersListParams = {
  q: '',
  role: undefined,
  status: 'all',
  sort: 'name',
  page: 1,
  pageSize: 25,
};

const shape = userListQuerySchema.shape;

/**
 * Reads the list's state from the address bar. A hand-edited or stale link never breaks the page:
 * each value that does not parse falls back to its default on its own.
 */
export function parseUsersListParams(search: URLSearchParams): UsersListParams {
  const value = (key: string) => search.get(key) ?? undefined;
  const q = shape.q.safeParse(value('q'));
  const role = shape.role.safeParse(value('role'));
  const status = shape.status.safeParse(value('status'));
  const sort = shape.sort.safeParse(value('sort'));
  const page = pageQuerySchema.shape.page.safeParse(value('page'));
  const pageSize = pageQuerySchema.shape.pageSize.safeParse(value('pageSize'));
  return {
    q: (q.success ? q.data : undefined) ?? defaultUsersListParams.q,
    role: role.success ? role.data : undefined,
    status: status.success ? status.data : defaultUsersListParams.status,
    sort: sort.success ? sort.data : defaultUsersListParams.sort,
    page: page.success ? page.data : defaultUsersListParams.page,
    pageSize: pageSize.success ? pageSize.data : defaultUsersListParams.pageSize,
  };
}

/** The URL search for a list state, leaving defaults out so shared links stay short. */
export function usersListSearch(params: UsersListParams): Record<string, string | number | undefined> {
  const d = defaultUsersListParams;
  return {
    q: params.q.trim() || undefined,
    role: params.role,
    status: params.status === d.status ? undefined : params.status,
    sort: params.sort === d.sort ? undefined : params.sort,
    page: params.page === d.page ? undefined : params.page,
    pageSize: params.pageSize === d.pageSize ? undefined : params.pageSize,
  };
}

/** `-createdAt` → TanStack sorting state `[{ id: 'createdAt', desc: true }]`. */
export function sortingFromParam(sort: UserSort): SortingState {
  const desc = sort.startsWith('-');
  return [{ id: desc ? sort.slice(1) : sort, desc }];
}

/** TanStack sorting state → the API's `sort` value; unknown columns fall back to name. */
export function sortParamFromSorting(sorting: SortingState): UserSort {
  const first = sorting[0];
  if (!first) return defaultUsersListParams.sort;
  const candidate = `${first.desc ? '-' : ''}${first.id}`;
  const parsed = shape.sort.safeParse(candidate);
  return parsed.success ? parsed.data : defaultUsersListParams.sort;
}
