import { verifyResponseSchema } from '@stringfield/shared';
import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Recomputes the evidence digest now and compares it with the one stored at sign-off. */
export function verifySignOff(workOrderId: number) {
  return api.get(`/api/work-orders/${workOrderId}/sign-off/verify`, verifyResponseSchema);
}

/** A mutation, not a query: each press is a fresh check the person asked for, never a cached answer. */
export function useVerifySignOff(workOrderId: number) {
  return useMutation({ mutationFn: () => verifySignOff(workOrderId) });
}
