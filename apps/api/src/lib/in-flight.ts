import type { Server } from 'node:http';
import net, { type Socket } from 'node:net';
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
// Connections, and those with an answer not yet handed to the system in full (see stopAccepting).
const connections = new Set<Socket>();
const answering = new Map<Socket, number>();

function answered(socket: Socket) {
  const left = (answering.get(socket) ?? 1) - 1;
  if (left > 0) answering.set(socket, left);
  else answering.delete(socket);
}

function release() {
  open--;
  if (open === 0) for (const wake of idleWaiters) wake();
}

export const countInFlight: RequestHandler = (req, res, next) => {
  open++;
  const socket = req.socket;
  answering.set(socket, (answering.get(socket) ?? 0) + 1);
  let isAnswering = true;
  const answerOut = () => {
    if (!isAnswering) return;
    isAnswering = false;
    answered(socket);
  };
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
  // 'finish': all of the answer has been handed to the system. One whose headers went out keep-alive before
  // the drain began ends its connection then (a graceful close), rather than leave it open for a next
  // request until the shutdown deadline; any sooner would cut the answer's tail off. (Node has detached
  // the response from its socket by then; the request's is the same one.)
  res.once('finish', () => {
    answerOut();
    if (draining && res.shouldKeepAlive) socket.end();
  });
  res.once('close', () => {
    answerOut();
    if (counted) setTimeout(done, ABANDONED_GRACE_MS).unref();
  });
  next();
};

/** Keeps count of the server's connections, for `stopAccepting`. */
export function trackConnections(server: Server): void {
  server.on('connection', (socket: Socket) => {
    connections.add(socket);
    socket.once('close', () => {
      connections.delete(socket);
      answering.delete(socket);
    });
  });
}

/** From now on, answers carry `Connection: close`. */
export function beginDraining(): void {
  draining = true;
}

/**
 * Stops taking connections and ends the idle keep-alive ones; resolves when the last connection has
 * closed. Not `server.close()`: Node's closes every connection whose handler has called `end()`, even one
 * whose answer still waits in the process for a slow reader (a photo written in one piece), and that
 * answer's tail would be lost. A connection still answering closes once its answer is out (see 'finish').
 */
export function stopAccepting(server: Server): Promise<void> {
  const closed = new Promise<void>((resolve) => net.Server.prototype.close.call(server, () => resolve()));
  for (const socket of connections) if (!answering.has(socket)) socket.end();
  return closed;
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
