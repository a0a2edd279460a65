import { ApiError, clearCsrfToken, genericMessage, getCsrfToken, parseApiError } from './api-client';

export type UploadProgress = { loadedBytes: number; totalBytes: number | undefined };

/** What came back from an upload: the status, the raw text and the parsed JSON (undefined if not JSON). */
export type UploadAnswer = { status: number; text: string; json: unknown };

function send(url: string, form: FormData, token: string, onProgress?: (p: UploadProgress) => void, signal?: AbortSignal): Promise<UploadAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('x-csrf-token', token);
    xhr.upload.onprogress = (event) => onProgress?.({ loadedBytes: event.loaded, totalBytes: event.lengthComputable ? event.total : undefined });
    xhr.onload = () => {
      let json: unknown;
      try {
        json = JSON.parse(xhr.responseText);
      } catch {
        json = undefined;
      }
      resolve({ status: xhr.status, text: xhr.responseText, json });
    };
    xhr.onerror = () => reject(new ApiError({ status: 0, code: 'NETWORK', message: genericMessage(0) }));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/**
 * POSTs a multipart form with upload progress (fetch() cannot report it; files over a site's mobile link
 * take a while). Sends the CSRF token and, when the token was stale, fetches a new one and retries once.
 * `makeForm` is called for each attempt, since a FormData is sent only once.
 */
export async function uploadForm(
  url: string,
  makeForm: () => FormData,
  { onProgress, signal }: { onProgress?: (p: UploadProgress) => void; signal?: AbortSignal } = {},
): Promise<UploadAnswer> {
  let answer = await send(url, makeForm(), await getCsrfToken(), onProgress, signal);
  if (answer.status === 403 && parseApiError(answer.status, answer.text).code === 'CSRF_FAILED') {
    clearCsrfToken();
    answer = await send(url, makeForm(), await getCsrfToken(), onProgress, signal);
  }
  return answer;
}
