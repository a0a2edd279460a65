/** Query keys for the session, from one place so invalidation can't miss one. */
export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};
