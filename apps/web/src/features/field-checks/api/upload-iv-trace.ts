import { ivTraceSchema, type IvTrace } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError, apiUrl, clearCsrfToken, genericMessage, getCsrfToken, parseApiError } from '@/lib/api-client';
import { fieldCheckKeys } from './keys';

async function postFile(checkId: number, file: File, token: string): Promise<Response> {
  const body = new FormData();
  body.append('file', file, file.name);
  try {
    return await fetch(apiUrl(`/api/checks/${checkId}/iv-trace`), {
      method: 'POST',
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'x-csrf-token': token },
      body,
    });
  } catch {
    throw new ApiError({ status: 0, code: 'NETWORK', message: genericMessage(0) });
  }
}

/**
 * Sends a tracer's CSV as multipart field "file". The JSON client cannot send a form, so this call
 * does its own fetch with the same CSRF token and the same error shape (a malformed file's message
 * names the line).
 */
export async function uploadIvTrace({ checkId, file }: { checkId: number; file: File }): Promise<IvTrace> {
  let response = await postFile(checkId, file, await getCsrfToken());
  let text = await response.text();
  if (response.status === 403 && text.includes('CSRF_FAILED')) {
    clearCsrfToken();
    response = await postFile(checkId, file, await getCsrfToken());
    text = await response.text();
  }
  if (!response.ok) throw parseApiError(response.status, text);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    json = undefined;
  }
  const parsed = ivTraceSchema.safeParse(json);
  if (!parsed.success) throw new ApiError({ status: response.status, code: 'BAD_RESPONSE', message: 'The trace was stored, but the answer could not be read. Reload the page.' });
  return parsed.data;
}

export function useUploadIvTrace(workOrderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadIvTrace,
    onSuccess: (trace) => {
      queryClient.setQueryData(fieldCheckKeys.ivTrace(trace.checkId), trace);
      return queryClient.invalidateQueries({ queryKey: fieldCheckKeys.ticketChecks(workOrderId) });
    },
  });
}
