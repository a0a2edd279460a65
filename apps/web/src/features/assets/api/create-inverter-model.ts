import { inverterModelSchema, type InverterModelInput, type InverterModel } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assetKeys } from './keys';

export function createInverterModel(input: InverterModelInput): Promise<InverterModel> {
  return api.post('/api/inverter-models', input, inverterModelSchema);
}

export function useCreateInverterModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInverterModel,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assetKeys.inverterModels() }),
  });
}
