import { inverterModelSchema, type InverterModel } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

/** Archived datasheets stay on the strings that use them but are no longer offered for new ones. */
export function setInverterModelArchived({ id, isArchived }: { id: number; isArchived: boolean }): Promise<InverterModel> {
  return api.patch(`/api/inverter-models/${id}`, { isArchived }, inverterModelSchema);
}

export function useSetInverterModelArchived() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setInverterModelArchived,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.inverterModels() }),
  });
}
