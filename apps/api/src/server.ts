import { createApp } from './app.ts';
import { env } from './config/env.ts';
import { beginDraining, requestsInFlight, requestsSettled, stopAccepting, trackConnections } from './lib/in-flight.ts';
import { logger } from './lib/logger.ts';
import { closeMailer, mailIdle, startMailSweep } from './lib/mailer.ts';
import { startOverdueSweep } from './services/overdue-sweep.service.ts';
import { sequelize } from './models/index.ts';

const app = createApp();
const server = app.listen(env.PORT, env.HOST, () => {
  logger.info(`Stringfield is serving on ${env.APP_URL}`);
});
trackConnections(server);
server.on('error', (err) => {
  logger.fatal({ err }, `could not listen on ${env.HOST}:${env.PORT}`);
  process.exit(1);
});
const stopSweep = startMailSweep();
const stopOverdue = startOverdueSweep();

type PoolGauge = { using: number; waiting: number };

/**
 * Resolves once no database connection has been in use or awaited for `quietMs` on end (false after
 * `timeoutMs`). A client that hangs up does not stop its handler — a check being saved, a session being
 * written — and its socket closing says nothing about that work, but the pool does.
 */
function databaseQuiet(quietMs: number, timeoutMs: number): Promise<boolean> {
  const pool = (sequelize.connectionManager as unknown as { pool?: PoolGauge }).pool;
  if (!pool || typeof pool.using !== 'number') return Promise.resolve(true);
  const deadline = Date.now() + timeoutMs;
  let quietSince = Date.now();
  return new Promise((resolve) => {
    const timer = setInterval(() => {
      if (pool.using > 0 || pool.waiting > 0) quietSince = Date.now();
      else if (Date.now() - quietSince >= quietMs) {
        clearInterval(timer);
        resolve(true);
      }
      if (Date.now() > deadline) {
        clearInterval(timer);
        resolve(false);
      }
    }, 10);
  });
}

let closing = false;
async function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  logger.info({ signal }, 'shutting down');
  setTimeout(() => process.exit(1), 10_000).unref();
  let code = 0;
  const step = async (what: string, run: () => unknown) => {
    try {
      await run();
    } catch (err) {
      code = 1;
      logger.error({ err }, `shutdown: ${what} failed`);
    }
  };
  const deadline = Date.now() + 7_000;
  let closed: Promise<void> = Promise.resolve();
  await step('stopping the sweeps', () => {
    stopSweep();
    stopOverdue();
  });
  await step('closing the listener', () => {
    // No new connections; answers from now on carry `Connection: close`; idle keep-alive ones close now.
    beginDraining();
    closed = stopAccepting(server);
  });
  await step('waiting for requests', async () => {
    if (!(await requestsSettled(deadline))) logger.warn({ inFlight: requestsInFlight() }, 'requests still running at shutdown; closing anyway');
    if (!(await databaseQuiet(200, Math.max(0, deadline - Date.now())))) logger.warn('database work still running at shutdown; closing anyway');
    // With `Connection: close` on every answer, each socket closes once its answer is flushed (an answer
    // whose headers went out keep-alive before the drain is ended by lib/in-flight.ts once the system has
    // all of it); what is still open at the deadline (a client that reads too slowly) is closed then.
    await Promise.race([closed, new Promise((resolve) => setTimeout(resolve, Math.max(0, deadline - Date.now())))]);
    server.closeAllConnections();
    await closed;
  });
  await step('sending queued mail', async () => {
    await mailIdle();
    closeMailer();
  });
  await step('closing the database pool', () => sequelize.close());
  process.exit(code);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
