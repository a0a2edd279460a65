import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { apiRequest, clearCsrfToken, isApiError } from './api-client';

type Call = { url: string; method: string; token: string | undefined };

/** A fake server: hands out numbered CSRF tokens and accepts only the newest one. */
function fakeServer(options: { rejectFirstToken?: boolean } = {}) {
  const calls: Call[] = [];
  let issued = 0;
  const fetchMock = vi.fn((input: string, init: RequestInit = {}) => {
    const headers = new Headers(init.headers);
    const method = init.method ?? 'GET';
    calls.push({ url: input, method, token: headers.get('x-csrf-token') ?? undefined });
    if (input === '/api/auth/csrf') {
      issued += 1;
      return Promise.resolve(new Response(JSON.stringify({ csrfToken: `token-${issued}` }), { status: 200 }));
    }
    const token = headers.get('x-csrf-token');
    const isAccepted =
      method === 'GET' || (token === `token-${issued}` && !(options.rejectFirstToken && token === 'token-1'));
    if (!isAccepted) {
      return Promise.resolve(new Response(JSON.stringify({ error: { code: 'CSRF_FAILED', message: 'Stale token' } }), { status: 403 }));
    }
    return Promise.resolve(new Response(JSON.stringify({ ok: true }), { status: 200 }));
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls };
}

const okSchema = z.object({ ok: z.boolean() });

describe('CSRF handling', () => {
  beforeEach(() => clearCsrfToken());
  afterEach(() => vi.unstubAllGlobals());

  it('fetches a token once and sends it with every change', async () => {
    const { calls } = fakeServer();
    await apiRequest('/api/users', { method: 'POST', body: {}, schema: okSchema });
    await apiRequest('/api/users/1', { method: 'PATCH', body: {}, schema: okSchema });
    expect(calls.map((c) => `${c.method} ${c.url} ${c.token ?? '-'}`)).toEqual([
      'GET /api/auth/csrf -',
      'POST /api/users token-1',
      'PATCH /api/users/1 token-1',
    ]);
  });

  it('sends no token with a read', async () => {
    const { calls } = fakeServer();
    await apiRequest('/api/users', { schema: okSchema });
    expect(calls).toEqual([{ url: '/api/users', method: 'GET', token: undefined }]);
  });

  it('refetches the token and retries once when the server says CSRF_FAILED', async () => {
    const { calls } = fakeServer({ rejectFirstToken: true });
    await expect(apiRequest('/api/users', { method: 'POST', body: {}, schema: okSchema })).resolves.toEqual({ ok: true });
    expect(calls.map((c) => `${c.method} ${c.url} ${c.token ?? '-'}`)).toEqual([
      'GET /api/auth/csrf -',
      'POST /api/users token-1',
      'GET /api/auth/csrf -',
      'POST /api/users token-2',
    ]);
  });

  it('gives up after one retry rather than looping', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn((input: string) =>
        Promise.resolve(
          input === '/api/auth/csrf'
            ? new Response(JSON.stringify({ csrfToken: 'always-stale' }), { status: 200 })
            : new Response(JSON.stringify({ error: { code: 'CSRF_FAILED', message: 'Stale token' } }), { status: 403 }),
        ),
      ),
    );
    const failure: unknown = await apiRequest('/api/auth/logout', { method: 'POST' }).catch((error: unknown) => error);
    expect(isApiError(failure) && failure.code).toBe('CSRF_FAILED');
    expect(vi.mocked(fetch)).toHaveBeenCalledTimes(4);
  });

  it('turns a dropped connection into a NETWORK error with a plain message', async () => {
    vi.stubGlobal('fetch', vi.fn(() => Promise.reject(new TypeError('Failed to fetch'))));
    const failure: unknown = await apiRequest('/api/auth/me').catch((error: unknown) => error);
    expect(failure).toMatchObject({ status: 0, code: 'NETWORK' });
  });

  it('rejects a success body that does not match the schema', async () => {
    vi.stubGlobal('fetch', vi.fn(() => Promise.resolve(new Response(JSON.stringify({ ok: 'yes' }), { status: 200 }))));
    const failure: unknown = await apiRequest('/api/thing', { schema: okSchema }).catch((error: unknown) => error);
    expect(failure).toMatchObject({ code: 'BAD_RESPONSE' });
  });
});
