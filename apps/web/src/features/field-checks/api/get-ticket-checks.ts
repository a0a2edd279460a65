import { stringCheckSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { fieldCheckKeys } from './keys';

const checksResponseSchema = z.object({ items: z.array(stringCheckSchema) });

/**
 * Every check of a ticket, corrected ones included (oldest first): the page derives the current
 * reading per string and the greyed history from the one list.
 */
export async function getTicketChecks(workOrderId: number, signal?: AbortSignal) {
  const { items } = await api.get(`/api/work-orders/${workOrderId}/checks`, checksResponseSchema, {
    signal,
    query: { includeSuperseded: true },
  });
  return items;
}

export const ticketChecksQueryOptions = (workOrderId: number) =>
  answeredEarly(
    queryOptions({
      queryKey: fieldCheckKeys.ticketChecks(workOrderId),
      queryFn: ({ signal }) => getTicketChecks(workOrderId, signal),
    }),
  );

export function useTicketChecks(workOrderId: number) {
  return useQuery(ticketChecksQueryOptions(workOrderId));
}
