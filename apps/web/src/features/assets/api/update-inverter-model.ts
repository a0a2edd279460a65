import { inverterModelSchema, type InverterModelInput, type InverterModel } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { assetKeys } from './keys';

/** Replaces the whole datasheet (PUT); strings using it are re-checked by the server on their next read. */
export function updateInverterModel({ id, input }: { id: number; input: InverterModelInput }): Promise<InverterModel> {
  return apiRequest(`/api/inverter-models/${id}`, { method: 'PUT', body: input, schema: inverterModelSchema });
}

export function useUpdateInverterModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateInverterModel,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: assetKeys.inverterModels() });
      // Sizing verdicts of every site depend on the datasheets.
      await queryClient.invalidateQueries({ queryKey: assetKeys.sites() });
      await queryClient.invalidateQueries({ queryKey: assetKeys.strings() });
    },
  });
}
