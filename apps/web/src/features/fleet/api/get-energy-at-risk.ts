import { energyAtRiskItemSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { fleetKeys } from './keys';

const energyAtRiskSchema = z.object({ items: z.array(energyAtRiskItemSchema), note: z.string() });
export type EnergyAtRisk = z.infer<typeof energyAtRiskSchema>;

/** Open tickets with the power their strings are missing, largest first, and the sentence saying how it is estimated. */
export function getEnergyAtRisk(siteId: number | undefined, signal?: AbortSignal) {
  return api.get('/api/fleet/energy-at-risk', energyAtRiskSchema, { signal, query: { siteId } });
}

export const energyAtRiskQueryOptions = (siteId: number | undefined) =>
  queryOptions({
    queryKey: fleetKeys.energyFor(siteId),
    queryFn: ({ signal }) => getEnergyAtRisk(siteId, signal),
    staleTime: 60_000,
  });

export function useEnergyAtRisk(siteId: number | undefined) {
  return useQuery(energyAtRiskQueryOptions(siteId));
}
