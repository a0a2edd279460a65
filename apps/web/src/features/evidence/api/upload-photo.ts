import { type Photo, type PhotoMeta } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { ApiError, apiUrl, parseApiError } from '@/lib/api-client';
import { uploadForm, type UploadProgress } from '@/lib/upload';
import { photosResponseSchema } from './get-photos';
import { evidenceKeys } from './keys';

export type { UploadProgress };

/**
 * Uploads one photo with its tag, string, module position and caption. Refusals (HEIC, too large,
 * not an image, not in the field) come back as an ApiError whose message names the file.
 */
export async function uploadPhoto({
  workOrderId,
  file,
  meta,
  onProgress,
  signal,
}: {
  workOrderId: number;
  file: File;
  meta: PhotoMeta;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}): Promise<Photo> {
  const url = apiUrl(`/api/work-orders/${workOrderId}/photos`);
  const sent = await uploadForm(
    url,
    () => {
      const form = new FormData();
      // The API pairs `meta[i]` with the i-th `files` part; one file per request keeps each retry alone.
      form.append('meta', JSON.stringify([meta]));
      form.append('files', file, file.name);
      return form;
    },
    { onProgress, signal },
  );
  if (sent.status >= 200 && sent.status < 300) {
    const parsed = photosResponseSchema.safeParse(sent.json);
    const photo = parsed.success ? parsed.data.items[0] : undefined;
    if (photo) return photo;
    throw new ApiError({
      status: sent.status,
      code: 'BAD_RESPONSE',
      message: 'Stringfield answered in a way this page does not understand. Reload the page; if it persists, tell your administrator.',
    });
  }
  throw parseApiError(sent.status, sent.text);
}

/**
 * The upload function for one ticket, refreshing its gallery after each stored photo. Not a
 * useMutation: the uploader runs several files side by side, each with its own state.
 */
export function useUploadPhoto(workOrderId: number) {
  const queryClient = useQueryClient();
  return useCallback(
    async (input: { file: File; meta: PhotoMeta; onProgress?: (p: UploadProgress) => void; signal?: AbortSignal }) => {
      const photo = await uploadPhoto({ workOrderId, ...input });
      await queryClient.invalidateQueries({ queryKey: evidenceKeys.photos(workOrderId) });
      return photo;
    },
    [queryClient, workOrderId],
  );
}
