import { diodeReplacementSchema, type DiodeReplacement, type DiodeReplacementInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { evidenceKeys } from './keys';

export function createDiodeReplacement(workOrderId: number, input: DiodeReplacementInput) {
  return api.post(`/api/work-orders/${workOrderId}/diode-replacements`, input, diodeReplacementSchema);
}

/** Replaces the whole record (PUT): send every field, not just the changed ones. */
export function updateDiodeReplacement(id: number, input: DiodeReplacementInput) {
  return api.put(`/api/diode-replacements/${id}`, input, diodeReplacementSchema);
}

/** Creates a record, or completes one when `id` is given. */
export function useSaveDiodeReplacement(workOrderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id?: number; input: DiodeReplacementInput }): Promise<DiodeReplacement> =>
      id ? updateDiodeReplacement(id, input) : createDiodeReplacement(workOrderId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: evidenceKeys.diodes(workOrderId) });
      await queryClient.invalidateQueries({ queryKey: evidenceKeys.stringDiodesAll() });
    },
  });
}
