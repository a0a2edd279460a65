import { signOffRecordSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { signOffKeys } from './keys';

const signOffResponseSchema = z.object({ signOff: signOffRecordSchema.nullable() });

/** The sign-off record of a ticket, or null before sign-off. */
export function getSignOff(workOrderId: number, signal?: AbortSignal) {
  return api.get(`/api/work-orders/${workOrderId}/sign-off`, signOffResponseSchema, { signal }).then((r) => r.signOff);
}

export const signOffQueryOptions = (workOrderId: number) =>
  queryOptions({
    queryKey: signOffKeys.record(workOrderId),
    queryFn: ({ signal }) => getSignOff(workOrderId, signal),
  });

export function useSignOff(workOrderId: number, options: { isEnabled?: boolean } = {}) {
  return useQuery({ ...signOffQueryOptions(workOrderId), enabled: options.isEnabled ?? true });
}
