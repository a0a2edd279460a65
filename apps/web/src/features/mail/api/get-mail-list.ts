import { mailSummarySchema, pageOf } from '@stringfield/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { mailKeys } from './keys';

const mailPageSchema = pageOf(mailSummarySchema);

export type MailListParams = { page: number; pageSize: number };

export function getMailList(params: MailListParams, signal?: AbortSignal) {
  return api.get('/api/mail', mailPageSchema, { signal, query: params });
}

export const mailListQueryOptions = (params: MailListParams) =>
  queryOptions({
    queryKey: mailKeys.list(params),
    queryFn: ({ signal }) => getMailList(params, signal),
    placeholderData: keepPreviousData,
    // New invitations and reset links land here while someone waits for them.
    refetchInterval: 15_000,
  });

export function useMailList(params: MailListParams) {
  return useQuery(mailListQueryOptions(params));
}
