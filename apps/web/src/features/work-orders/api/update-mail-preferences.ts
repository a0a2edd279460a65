import { mailPreferencesSchema } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

export type MailPreferences = z.infer<typeof mailPreferencesSchema>;

export function updateMailPreferences(preferences: MailPreferences) {
  return api.put('/api/me/mail-preferences', preferences, mailPreferencesSchema);
}

export function useUpdateMailPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMailPreferences,
    onSuccess: (preferences) => queryClient.setQueryData(workOrderKeys.mailPreferences(), preferences),
  });
}
