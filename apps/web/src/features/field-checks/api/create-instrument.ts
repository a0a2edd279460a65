import { instrumentSchema, type Instrument, type InstrumentInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fieldCheckKeys } from './keys';

export function createInstrument(input: InstrumentInput): Promise<Instrument> {
  return api.post('/api/instruments', input, instrumentSchema);
}

export function useCreateInstrument() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInstrument,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldCheckKeys.instruments() }),
  });
}
