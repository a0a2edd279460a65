import { mailPreferencesSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

/** The mail categories the signed-in person has turned off. */
export function getMailPreferences(signal?: AbortSignal) {
  return api.get('/api/me/mail-preferences', mailPreferencesSchema, { signal });
}

export const mailPreferencesQueryOptions = () =>
  queryOptions({
    queryKey: workOrderKeys.mailPreferences(),
    queryFn: ({ signal }) => getMailPreferences(signal),
  });

export function useMailPreferences() {
  return useQuery(mailPreferencesQueryOptions());
}
