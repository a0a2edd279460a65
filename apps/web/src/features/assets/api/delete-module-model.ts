import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

/** Deletes an unused datasheet; the API answers 409 with "used by N …, archive instead" otherwise. */
export function deleteModuleModel(id: number): Promise<undefined> {
  return api.delete(`/api/module-models/${id}`);
}

export function useDeleteModuleModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteModuleModel,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.moduleModels() }),
  });
}
