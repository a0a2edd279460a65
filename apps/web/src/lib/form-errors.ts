import { isApiError } from './api-client';

export type ServerErrorSplit<Field extends string> = {
  /** Messages that belong beside a field the form actually has. */
  fieldErrors: Array<[Field, string]>;
  /** What to show above the form: the error's message when no field took it, else nothing. */
  formError: string | undefined;
};

/**
 * Splits a failed submission into per-field messages (for `setError`) and one form-level message.
 * Field messages for fields the form does not show go to the form-level message, so nothing is lost.
 */
export function splitServerErrors<Field extends string>(error: unknown, knownFields: readonly Field[]): ServerErrorSplit<Field> {
  if (!isApiError(error)) {
    return { fieldErrors: [], formError: error instanceof Error ? error.message : 'Something went wrong. Try again.' };
  }
  const fieldErrors: Array<[Field, string]> = [];
  const stray: string[] = [];
  for (const [name, message] of Object.entries(error.fields ?? {})) {
    if ((knownFields as readonly string[]).includes(name)) fieldErrors.push([name as Field, message]);
    else stray.push(message);
  }
  if (fieldErrors.length > 0) return { fieldErrors, formError: stray.length ? stray.join(' ') : undefined };
  return { fieldErrors, formError: error.message };
}
