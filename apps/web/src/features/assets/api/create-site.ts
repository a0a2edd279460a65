import { siteSchema, type Site, type SiteInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

export function createSite(input: SiteInput): Promise<Site> {
  return api.post('/api/sites', input, siteSchema);
}

export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSite,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.siteLists() }),
  });
}
