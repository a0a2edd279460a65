import { instrumentSchema, type Instrument, type InstrumentInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { fieldCheckKeys } from './keys';

export type InstrumentChanges = Partial<InstrumentInput> & { isArchived?: boolean };

/** Edits an instrument; `{ isArchived: true }` archives it (kept for the checks that name it). */
export function updateInstrument({ id, changes }: { id: number; changes: InstrumentChanges }): Promise<Instrument> {
  return api.patch(`/api/instruments/${id}`, changes, instrumentSchema);
}

export function useUpdateInstrument() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateInstrument,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldCheckKeys.instruments() }),
  });
}
