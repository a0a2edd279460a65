import { moduleModelSchema, type ModuleModelInput, type ModuleModel } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { assetKeys } from './keys';

/** Replaces the whole datasheet (PUT); strings using it are re-checked by the server on their next read. */
export function updateModuleModel({ id, input }: { id: number; input: ModuleModelInput }): Promise<ModuleModel> {
  return apiRequest(`/api/module-models/${id}`, { method: 'PUT', body: input, schema: moduleModelSchema });
}

export function useUpdateModuleModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateModuleModel,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: assetKeys.moduleModels() });
      // Sizing verdicts of every site depend on the datasheets.
      await queryClient.invalidateQueries({ queryKey: assetKeys.sites() });
      await queryClient.invalidateQueries({ queryKey: assetKeys.strings() });
    },
  });
}
