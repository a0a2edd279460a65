import { moduleModelSchema, type ModuleModelInput, type ModuleModel } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

export function createModuleModel(input: ModuleModelInput): Promise<ModuleModel> {
  return api.post('/api/module-models', input, moduleModelSchema);
}

export function useCreateModuleModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createModuleModel,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.moduleModels() }),
  });
}
