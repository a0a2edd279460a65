import { photoSchema, type Photo, type ThermalFindingInput } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { evidenceKeys } from './keys';

/** Records (or replaces) the finding of a thermal image; the server classifies it (CoA 1/2/3). */
export function recordThermalFinding(photoId: number, input: ThermalFindingInput) {
  return api.put(`/api/photos/${photoId}/thermal`, input, photoSchema);
}

export function useRecordThermalFinding(workOrderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ photoId, input }: { photoId: number; input: ThermalFindingInput }) => recordThermalFinding(photoId, input),
    onSuccess: (photo: Photo) => {
      queryClient.setQueryData<Photo[]>(evidenceKeys.photos(workOrderId), (old) => old?.map((p) => (p.id === photo.id ? photo : p)));
      return queryClient.invalidateQueries({ queryKey: evidenceKeys.photos(workOrderId) });
    },
  });
}
