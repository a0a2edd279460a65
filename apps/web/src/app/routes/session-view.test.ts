import type { SessionUser } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { offlineWithoutSession, sessionView, type SessionQueryState } from './session-view';

const user: SessionUser = { id: 7, name: 'Tess Tech', email: 'tech@stringfield.test', role: 'technician' };
const network = new ApiError({ status: 0, code: 'NETWORK', message: 'Stringfield could not be reached.' });
const serverError = new ApiError({ status: 500, code: 'INTERNAL', message: 'Something broke.' });
const state = (patch: Partial<SessionQueryState>): SessionQueryState => ({ status: 'success', fetchStatus: 'idle', data: undefined, error: null, ...patch });

describe('sessionView', () => {
  it('waits while the first check runs', () => {
    expect(sessionView(state({ status: 'pending', fetchStatus: 'fetching' }), true)).toEqual({ kind: 'loading' });
  });

  it('shows the fresh session plainly', () => {
    expect(sessionView(state({ data: user }), true)).toEqual({ kind: 'signed-in', user, isSaved: false });
  });

  it('keeps the saved session through a network error, marked as saved', () => {
    expect(sessionView(state({ status: 'error', data: user, error: network }), true)).toEqual({ kind: 'signed-in', user, isSaved: true });
    const gateway = new ApiError({ status: 503, code: 'UNAVAILABLE', message: 'Down.' });
    expect(sessionView(state({ status: 'error', data: user, error: gateway }), true)).toMatchObject({ kind: 'signed-in', isSaved: true });
  });

  it('keeps the saved session offline, while the check waits for a connection', () => {
    expect(sessionView(state({ data: user, fetchStatus: 'paused' }), false)).toEqual({ kind: 'signed-in', user, isSaved: true });
    expect(sessionView(state({ data: user }), false)).toEqual({ kind: 'signed-in', user, isSaved: true });
  });

  it('shows the error when nothing is saved', () => {
    expect(sessionView(state({ status: 'error', data: undefined, error: network }), true)).toEqual({ kind: 'error', error: network });
    expect(sessionView(state({ status: 'pending', fetchStatus: 'paused' }), false)).toEqual({ kind: 'error', error: offlineWithoutSession });
  });

  it('does not hide a server failure behind the saved copy', () => {
    expect(sessionView(state({ status: 'error', data: user, error: serverError }), true)).toEqual({ kind: 'error', error: serverError });
  });

  it('sends a 401 (an answer of null) to sign-in, saved copy or not', () => {
    expect(sessionView(state({ data: null }), true)).toEqual({ kind: 'signed-out' });
    expect(sessionView(state({ data: null, fetchStatus: 'paused' }), false)).toEqual({ kind: 'signed-out' });
  });
});
