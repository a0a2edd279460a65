import { apiErrorBodySchema, csrfResponseSchema } from '@stringfield/shared';
import type { z } from 'zod';
import { env } from '../config/env';

/** Codes the client adds to the server's closed set: the request never got an answer, or a strange one. */
export type ClientErrorCode = 'NETWORK' | 'BAD_RESPONSE';

/** Every failed API call ends as one of these, whatever went wrong on the way. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  /** HTTP status; 0 when the server could not be reached at all. */
  readonly status: number;
  /** A wire code (`VALIDATION_FAILED`, `CONFLICT`, …) or a client code (`NETWORK`, `BAD_RESPONSE`). */
  readonly code: string;
  /** Field name → message, for forms to show beside the fields. */
  readonly fields: Record<string, string> | undefined;
  /** The server's request id, worth quoting to whoever reads the logs. */
  readonly requestId: string | undefined;
  /** The parsed error body as sent, for the extra fields some answers carry (a 409's `current`); read it with `errorBodyField`. */
  readonly body: unknown;

  constructor(init: { status: number; code: string; message: string; fields?: Record<string, string>; requestId?: string; body?: unknown }) {
    super(init.message);
    this.status = init.status;
    this.code = init.code;
    this.fields = init.fields;
    this.requestId = init.requestId;
    this.body = init.body;
  }
}

/**
 * An extra top-level field of a failed answer's body (beside `error`), parsed with `schema`;
 * undefined when the error has no such field or it does not parse. E.g. the fresh record a 409 sends back.
 */
export function errorBodyField<S extends z.ZodType>(error: unknown, key: string, schema: S): z.output<S> | undefined {
  if (!isApiError(error) || typeof error.body !== 'object' || error.body === null) return undefined;
  const parsed = schema.safeParse((error.body as Record<string, unknown>)[key]);
  return parsed.success ? parsed.data : undefined;
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** What to tell a person when the server's answer carries no usable message. */
export function genericMessage(status: number): string {
  if (status === 0) return 'Stringfield could not be reached. Check your connection and try again.';
  if (status === 400) return 'Some of what was sent was not accepted. Check the form and try again.';
  if (status === 401) return 'Your session has ended. Sign in again to carry on.';
  if (status === 403) return 'Your role does not allow this.';
  if (status === 404) return 'That could not be found. It may have been removed.';
  if (status === 409) return 'That clashes with something that already exists.';
  if (status === 413) return 'That is too large to upload.';
  if (status === 429) return 'Too many attempts in a short time. Wait a minute and try again.';
  if (status === 503) return 'Stringfield is briefly unavailable. Try again in a moment.';
  return 'Something went wrong on our side. Try again; if it keeps happening, tell your administrator.';
}

const codeByStatus: Record<number, string> = {
  400: 'VALIDATION_FAILED',
  401: 'UNAUTHENTICATED',
  403: 'FORBIDDEN',
  404: 'NOT_FOUND',
  409: 'CONFLICT',
  413: 'PAYLOAD_TOO_LARGE',
  429: 'RATE_LIMITED',
  503: 'UNAVAILABLE',
};

/**
 * Turns a failed response's status and body text into an ApiError. The body should be the one
 * wire shape `{ error: { code, message, fields?, requestId? } }`; a proxy's HTML page or an empty
 * body still yields a sensible code and message.
 */
export function parseApiError(status: number, bodyText: string): ApiError {
  let json: unknown;
  try {
    json = bodyText ? JSON.parse(bodyText) : undefined;
  } catch {
    json = undefined;
  }
  const parsed = apiErrorBodySchema.safeParse(json);
  if (parsed.success) {
    const { code, message, fields, requestId } = parsed.data.error;
    return new ApiError({ status, code, message: message || genericMessage(status), fields, requestId, body: json });
  }
  return new ApiError({ status, code: codeByStatus[status] ?? 'INTERNAL', message: genericMessage(status) });
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

type RequestOptions<S extends z.ZodType | undefined> = {
  method?: Method;
  /** Serialised as JSON. */
  body?: unknown;
  /** Query string; empty values are left out. */
  query?: Record<string, string | number | boolean | null | undefined>;
  /** Parses the success body; leave out for answers without one (204). */
  schema?: S;
  signal?: AbortSignal;
};

type Result<S> = S extends z.ZodType ? z.output<S> : undefined;

/* The CSRF token lives in memory only. A session is regenerated on sign-in and sign-out, and the
   token goes with it, so both clear it; a stale token is also refetched once on CSRF_FAILED. */
let csrfToken: string | null = null;
let csrfPending: Promise<string> | null = null;

/** Forgets the CSRF token; call after sign-in and sign-out. */
export function clearCsrfToken(): void {
  csrfToken = null;
  csrfPending = null;
}

async function fetchCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  csrfPending ??= send('/api/auth/csrf', { method: 'GET', schema: csrfResponseSchema })
    .then(({ csrfToken: token }) => {
      csrfToken = token;
      return token;
    })
    .finally(() => {
      csrfPending = null;
    });
  return csrfPending;
}

/**
 * The session's CSRF token, fetched once and kept in memory, for requests that cannot go through
 * `apiRequest` (an XMLHttpRequest upload that reports progress). On a 403 `CSRF_FAILED`, call
 * `clearCsrfToken()` and ask again once.
 */
export function getCsrfToken(): Promise<string> {
  return fetchCsrfToken();
}

/** The full URL of an API path, with the configured base in front (empty in development and same-origin). */
export function apiUrl(path: string, query?: Record<string, string | number | boolean | null | undefined>): string {
  return buildUrl(path, query);
}

function buildUrl(path: string, query: RequestOptions<undefined>['query']): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value === undefined || value === null || value === '') continue;
    search.set(key, String(value));
  }
  const text = search.toString();
  return `${env.VITE_API_BASE_URL}${path}${text ? `?${text}` : ''}`;
}

async function send<S extends z.ZodType | undefined>(
  path: string,
  options: RequestOptions<S>,
  headers: Record<string, string> = {},
): Promise<Result<S>> {
  const method = options.method ?? 'GET';
  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        ...(options.body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...headers,
      },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError({ status: 0, code: 'NETWORK', message: genericMessage(0) });
  }

  const text = await response.text();
  if (!response.ok) throw parseApiError(response.status, text);
  if (!options.schema) return undefined as Result<S>;

  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    json = undefined;
  }
  const parsed = options.schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError({
      status: response.status,
      code: 'BAD_RESPONSE',
      message: 'Stringfield answered in a way this page does not understand. Reload the page; if it persists, tell your administrator.',
    });
  }
  return parsed.data as Result<S>;
}

/**
 * Calls the API. Non-GET requests carry the `x-csrf-token` header; on a 403 `CSRF_FAILED` the token
 * is fetched again and the request retried once.
 */
export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  path: string,
  options: RequestOptions<S> = {},
): Promise<Result<S>> {
  const method = options.method ?? 'GET';
  if (method === 'GET') return send(path, options);

  const token = await fetchCsrfToken();
  try {
    return await send(path, options, { 'x-csrf-token': token });
  } catch (error) {
    if (!(isApiError(error) && error.status === 403 && error.code === 'CSRF_FAILED')) throw error;
    clearCsrfToken();
    const fresh = await fetchCsrfToken();
    return send(path, options, { 'x-csrf-token': fresh });
  }
}

export const api = {
  get: <S extends z.ZodType>(path: string, schema: S, options: Omit<RequestOptions<S>, 'method' | 'schema' | 'body'> = {}) =>
    apiRequest(path, { ...options, method: 'GET', schema }),
  post: <S extends z.ZodType | undefined = undefined>(path: string, body?: unknown, schema?: S) =>
    apiRequest(path, { method: 'POST', body, schema }),
  patch: <S extends z.ZodType | undefined = undefined>(path: string, body: unknown, schema?: S) =>
    apiRequest(path, { method: 'PATCH', body, schema }),
  put: <S extends z.ZodType | undefined = undefined>(path: string, body: unknown, schema?: S) =>
    apiRequest(path, { method: 'PUT', body, schema }),
  delete: <S extends z.ZodType | undefined = undefined>(path: string, schema?: S) =>
    apiRequest(path, { method: 'DELETE', schema }),
};
