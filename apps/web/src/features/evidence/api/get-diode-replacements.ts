import { diodeReplacementSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { evidenceKeys } from './keys';

export const diodeReplacementsResponseSchema = z.object({ items: z.array(diodeReplacementSchema) });

/** The bypass-diode replacements recorded on a ticket, each with what is still missing. */
export function getDiodeReplacements(workOrderId: number, signal?: AbortSignal) {
  return api.get(`/api/work-orders/${workOrderId}/diode-replacements`, diodeReplacementsResponseSchema, { signal }).then((r) => r.items);
}

export const diodeReplacementsQueryOptions = (workOrderId: number) =>
  queryOptions({
    queryKey: evidenceKeys.diodes(workOrderId),
    queryFn: ({ signal }) => getDiodeReplacements(workOrderId, signal),
  });

export function useDiodeReplacements(workOrderId: number) {
  return useQuery(diodeReplacementsQueryOptions(workOrderId));
}
