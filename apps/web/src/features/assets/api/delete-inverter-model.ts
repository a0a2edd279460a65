import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

/** Deletes an unused datasheet; the API answers 409 with "used by N …, archive instead" otherwise. */
export function deleteInverterModel(id: number): Promise<undefined> {
  return api.delete(`/api/inverter-models/${id}`);
}

export function useDeleteInverterModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteInverterModel,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.inverterModels() }),
  });
}
