import type { RequestHandler, Response } from 'express';

/**
 * Requests counted from arrival until their handler ends the response — not until the socket closes: a
 * client that hangs up does not stop a photo being resized or a password being hashed, and a process told to
 * stop must let that work finish. A response the handler never ends once its client is gone (a stream it
 * abandoned) stops counting `ABANDONED_GRACE_MS` after the client left.
 */
const ABANDONED_GRACE_MS = 2_000;

let open = 0;
let draining = false;
const idleWaiters = new Set<() => void>();

function release() {
  open--;
  if (open === 0) for (const wake of idleWaiters) wake();
}

export const countInFlight: RequestHandler = (_req, res, next) => {
  open++;
  let counted = true;
  const done = () => {
    if (!counted) return;
    counted = false;
    release();
  };
  const end = res.end.bind(res) as (...args: unknown[]) => Response;
  res.end = ((...args: unknown[]) => {
    done();
    return end(...args);
  }) as Response['end'];
  // While draining, every answer asks its client to close: a keep-alive connection must not carry another
  // request into a process that is about to stop. writeHead is where Node sends the headers, however late
  // the middlewares above (session, compression) get to write them.
  const writeHead = res.writeHead.bind(res) as (...args: unknown[]) => Response;
  res.writeHead = ((...args: unknown[]) => {
    if (draining) res.shouldKeepAlive = false;
    return writeHead(...args);
  }) as Response['writeHead'];
  res.once('close', () => {
    if (counted) setTimeout(done, ABANDONED_GRACE_MS).unref();
  });
  next();
};

/** From now on, answers carry `Connection: close`. */
export function beginDraining(): void {
  draining = true;
}

export function requestsInFlight(): number {
  return open;
}

/** Resolves true once no request is in flight, or false at `deadline` (ms since the epoch). */
export function requestsSettled(deadline: number): Promise<boolean> {
  if (open === 0) return Promise.resolve(true);
  return new Promise((resolve) => {
    const finish = (ok: boolean) => {
      idleWaiters.delete(wake);
      clearTimeout(timer);
      resolve(ok);
    };
    const wake = () => finish(true);
    const timer = setTimeout(() => finish(open === 0), Math.max(0, deadline - Date.now()));
    idleWaiters.add(wake);
  });
}
