import { importPreviewSchema, type ImportPreview } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError, apiUrl, parseApiError } from '@/lib/api-client';
import { uploadForm, type UploadProgress } from '@/lib/upload';
import { assetKeys } from './keys';

export type ImportMode = 'dry-run' | 'commit';
export type { UploadProgress };

/** A refused import that still says why, row by row: the API's 400 carries the checked `preview`. */
export class ImportRejectedError extends ApiError {
  readonly preview: ImportPreview;
  constructor(error: ApiError, preview: ImportPreview) {
    super({ status: error.status, code: error.code, message: error.message, fields: error.fields, requestId: error.requestId });
    this.preview = preview;
  }
}

const rejectedBodySchema = z.object({ preview: importPreviewSchema });

/**
 * Uploads a layout CSV: `dry-run` checks every row and changes nothing; `commit` imports all rows in
 * one transaction or none. A refused commit throws ImportRejectedError with the row-by-row preview.
 */
export async function importLayout({
  siteId,
  file,
  mode,
  onProgress,
  signal,
}: {
  siteId: number;
  file: File;
  mode: ImportMode;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}): Promise<ImportPreview> {
  const url = apiUrl(`/api/sites/${siteId}/import`, { mode });
  const sent = await uploadForm(
    url,
    () => {
      const form = new FormData();
      form.append('file', file, file.name);
      return form;
    },
    { onProgress, signal },
  );
  const json = sent.json;
  if (sent.status >= 200 && sent.status < 300) {
    const parsed = importPreviewSchema.safeParse(json);
    if (parsed.success) return parsed.data;
    throw new ApiError({
      status: sent.status,
      code: 'BAD_RESPONSE',
      message: 'Stringfield answered in a way this page does not understand. Reload the page; if it persists, tell your administrator.',
    });
  }
  const error = parseApiError(sent.status, sent.text);
  const rejected = rejectedBodySchema.safeParse(json);
  if (rejected.success) throw new ImportRejectedError(error, rejected.data.preview);
  throw error;
}

export function useImportLayout(siteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { file: File; mode: ImportMode; onProgress?: (progress: UploadProgress) => void }) => importLayout({ siteId, ...input }),
    onSuccess: async (preview) => {
      if (!preview.committed) return;
      await queryClient.invalidateQueries({ queryKey: assetKeys.sites() });
      await queryClient.invalidateQueries({ queryKey: assetKeys.strings() });
    },
  });
}
