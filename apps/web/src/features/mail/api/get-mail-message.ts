import { mailMessageSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { mailKeys } from './keys';

export function getMailMessage(id: string, signal?: AbortSignal) {
  return api.get(`/api/mail/${encodeURIComponent(id)}`, mailMessageSchema, { signal });
}

export const mailMessageQueryOptions = (id: string) =>
  queryOptions({
    queryKey: mailKeys.detail(id),
    queryFn: ({ signal }) => getMailMessage(id, signal),
    // A caught message never changes.
    staleTime: Infinity,
  });

export function useMailMessage(id: string) {
  return useQuery(mailMessageQueryOptions(id));
}
