import { describe, expect, it } from 'vitest';
import { ApiError, genericMessage, parseApiError } from './api-client';
import { splitServerErrors } from './form-errors';
import { shouldRetry } from './query-client';

describe('parseApiError', () => {
  it('keeps code, message, field messages and request id from the wire shape', () => {
    const body = JSON.stringify({
      error: { code: 'VALIDATION_FAILED', message: 'Check the form', fields: { email: 'Enter a valid e-mail address' }, requestId: 'req-7' },
    });
    const error = parseApiError(400, body);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'VALIDATION_FAILED', message: 'Check the form', requestId: 'req-7' });
    expect(error.fields).toEqual({ email: 'Enter a valid e-mail address' });
  });

  it('tells a CSRF refusal apart from a role refusal, though both are 403', () => {
    const csrf = parseApiError(403, JSON.stringify({ error: { code: 'CSRF_FAILED', message: 'Bad token' } }));
    const role = parseApiError(403, JSON.stringify({ error: { code: 'FORBIDDEN', message: 'Not for your role' } }));
    expect(csrf.code).toBe('CSRF_FAILED');
    expect(role.code).toBe('FORBIDDEN');
  });

  it('falls back to a plain message when a proxy answers with an HTML page', () => {
    const error = parseApiError(502, '<html><body>Bad gateway</body></html>');
    expect(error.code).toBe('INTERNAL');
    expect(error.message).toBe(genericMessage(502));
    expect(error.fields).toBeUndefined();
  });

  it('derives the code from the status when the body is empty', () => {
    expect(parseApiError(429, '').code).toBe('RATE_LIMITED');
    expect(parseApiError(503, '').code).toBe('UNAVAILABLE');
    expect(parseApiError(401, '').message).toMatch(/sign in again/i);
  });

  it('ignores JSON that is not the error shape', () => {
    const error = parseApiError(500, JSON.stringify({ message: 'stack trace here' }));
    expect(error.message).not.toContain('stack trace');
  });
});

describe('splitServerErrors', () => {
  it('puts field messages beside the fields the form has and the rest above the form', () => {
    const error = new ApiError({
      status: 400,
      code: 'VALIDATION_FAILED',
      message: 'Check the form',
      fields: { email: 'Taken', tenant: 'Unknown tenant' },
    });
    expect(splitServerErrors(error, ['email', 'name'] as const)).toEqual({ fieldErrors: [['email', 'Taken']], formError: 'Unknown tenant' });
  });

  it('uses the message itself when no field is named', () => {
    const error = new ApiError({ status: 409, code: 'CONFLICT', message: 'That e-mail is taken' });
    expect(splitServerErrors(error, ['email'] as const)).toEqual({ fieldErrors: [], formError: 'That e-mail is taken' });
  });
});

describe('shouldRetry', () => {
  const error = (status: number) => new ApiError({ status, code: 'X', message: 'x' });

  it('retries a lost connection and a busy server, twice at most', () => {
    expect(shouldRetry(0, error(0))).toBe(true);
    expect(shouldRetry(1, error(503))).toBe(true);
    expect(shouldRetry(2, error(503))).toBe(false);
  });

  it('never retries an answer that will not change: 400, 401, 403, 404, 409', () => {
    for (const status of [400, 401, 403, 404, 409]) expect(shouldRetry(0, error(status))).toBe(false);
  });
});
