import { moduleModelSchema, type ModuleModel } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

/** Archived datasheets stay on the strings that use them but are no longer offered for new ones. */
export function setModuleModelArchived({ id, isArchived }: { id: number; isArchived: boolean }): Promise<ModuleModel> {
  return api.patch(`/api/module-models/${id}`, { isArchived }, moduleModelSchema);
}

export function useSetModuleModelArchived() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setModuleModelArchived,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.moduleModels() }),
  });
}
