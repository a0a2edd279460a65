import { siteSchema, type Site } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fleetKeys } from './keys';

/** Changes the site's assumed peak sun hours (h/day), the multiplier behind every daily kWh estimate. */
export function updatePeakSunHours({ siteId, peakSunHours }: { siteId: number; peakSunHours: number }): Promise<Site> {
  return api.patch(`/api/sites/${siteId}`, { peakSunHours }, siteSchema);
}

export function useUpdatePeakSunHours() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePeakSunHours,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: fleetKeys.sites() }),
        queryClient.invalidateQueries({ queryKey: fleetKeys.energy() }),
      ]),
  });
}
