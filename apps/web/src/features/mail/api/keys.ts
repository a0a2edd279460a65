/** Query keys for the mail catcher's messages. */
export const mailKeys = {
  all: ['mail'] as const,
  lists: () => [...mailKeys.all, 'list'] as const,
  list: (params: { page: number; pageSize: number }) => [...mailKeys.lists(), params] as const,
  details: () => [...mailKeys.all, 'detail'] as const,
  detail: (id: string) => [...mailKeys.details(), id] as const,
};
