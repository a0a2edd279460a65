import type { UsersListParams } from '../lib/list-params';

/** Query keys for people, from one place: mutations invalidate `userKeys.lists()`. */
export const userKeys = {
  all: ['users'] as const,
  lists: () => [...userKeys.all, 'list'] as const,
  list: (params: UsersListParams) => [...userKeys.lists(), params] as const,
};
