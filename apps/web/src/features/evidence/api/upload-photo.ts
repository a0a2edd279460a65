import { type Photo, type PhotoMeta } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { ApiError, apiUrl, clearCsrfToken, genericMessage, getCsrfToken, parseApiError } from '@/lib/api-client';
import { photosResponseSchema } from './get-photos';
import { evidenceKeys } from './keys';

export type UploadProgress = { loadedBytes: number; totalBytes: number | undefined };

type Sent = { status: number; text: string };

/* fetch() cannot report upload progress; a 6 MB photo over a site's mobile link takes a while. */
function post(url: string, file: File, meta: PhotoMeta, token: string, onProgress?: (p: UploadProgress) => void, signal?: AbortSignal): Promise<Sent> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('x-csrf-token', token);
    xhr.upload.onprogress = (event) => onProgress?.({ loadedBytes: event.loaded, totalBytes: event.lengthComputable ? event.total : undefined });
    xhr.onload = () => resolve({ status: xhr.status, text: xhr.responseText });
    xhr.onerror = () => reject(new ApiError({ status: 0, code: 'NETWORK', message: genericMessage(0) }));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    const form = new FormData();
    // The API pairs `meta[i]` with the i-th `files` part; one file per request keeps each retry alone.
    form.append('meta', JSON.stringify([meta]));
    form.append('files', file, file.name);
    xhr.send(form);
  });
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

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
  let sent = await post(url, file, meta, await getCsrfToken(), onProgress, signal);
  if (sent.status === 403 && parseApiError(sent.status, sent.text).code === 'CSRF_FAILED') {
    clearCsrfToken();
    sent = await post(url, file, meta, await getCsrfToken(), onProgress, signal);
  }
  if (sent.status >= 200 && sent.status < 300) {
    const parsed = photosResponseSchema.safeParse(parseJson(sent.text));
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
