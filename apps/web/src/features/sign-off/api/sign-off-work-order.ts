import { gateSchema, signOffRecordSchema, type Gate, type SignOffInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api, errorBodyField } from '@/lib/api-client';
import { signOffKeys } from './keys';

export function signOffWorkOrder(workOrderId: number, input: SignOffInput) {
  return api.post(`/api/work-orders/${workOrderId}/sign-off`, input, signOffRecordSchema);
}

/** The fresh checklist a refused sign-off (409) carries, if it carries one. */
export function gatesOfConflict(error: unknown): Gate[] | undefined {
  return errorBodyField(error, 'gates', z.array(gateSchema));
}

/**
 * Signs a ticket off. A 409 with `gates` refreshes the checklist in the cache at once, so the
 * supervisor sees what is still missing without another request.
 */
export function useSignOffWorkOrder(workOrderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignOffInput) => signOffWorkOrder(workOrderId, input),
    onSuccess: (record) => {
      queryClient.setQueryData(signOffKeys.record(workOrderId), record);
      return queryClient.invalidateQueries({ queryKey: signOffKeys.ticket(workOrderId) });
    },
    onError: (error) => {
      const gates = gatesOfConflict(error);
      if (gates) queryClient.setQueryData(signOffKeys.gates(workOrderId), { ok: gates.every((g) => g.ok), gates });
    },
  });
}
