import type { SessionUser } from '@stringfield/shared';
import { ApiError, isApiError } from '@/lib/api-client';

/** What the session query looks like to the protected layout (a subset of TanStack's result). */
export type SessionQueryState = {
  status: 'pending' | 'error' | 'success';
  fetchStatus: 'fetching' | 'paused' | 'idle';
  data: SessionUser | null | undefined;
  error: unknown;
};

export type SessionView =
  | { kind: 'loading' }
  | { kind: 'error'; error: unknown }
  | { kind: 'signed-out' }
  /** `isSaved`: the person comes from the copy kept on the device, because the server cannot be asked now. */
  | { kind: 'signed-in'; user: SessionUser; isSaved: boolean };

/** No answer at all, or a gateway saying the API behind it did not answer. */
export function isUnreachable(error: unknown): boolean {
  return isApiError(error) && (error.status === 0 || error.status === 502 || error.status === 503 || error.status === 504);
}

export const offlineWithoutSession = new ApiError({
  status: 0,
  code: 'NETWORK',
  message: 'This device is offline and holds no saved sign-in. Connect to the internet and try again.',
});

/**
 * Who to show, given the session query and the connection. A saved copy of the session (restored
 * from the device) carries the app through an offline start or a failed check; the error page is
 * only for when there is nothing saved. A 401 is an answer (`data: null`), never an error: sign in.
 */
export function sessionView(me: SessionQueryState, isOnline: boolean): SessionView {
  if (me.status === 'pending') {
    // Offline with nothing saved: TanStack pauses the check until a connection returns; say so.
    return me.fetchStatus === 'paused' ? { kind: 'error', error: offlineWithoutSession } : { kind: 'loading' };
  }
  if (me.status === 'error') {
    if (me.data && isUnreachable(me.error)) return { kind: 'signed-in', user: me.data, isSaved: true };
    return { kind: 'error', error: me.error };
  }
  if (!me.data) return { kind: 'signed-out' };
  return { kind: 'signed-in', user: me.data, isSaved: !isOnline || me.fetchStatus === 'paused' };
}
