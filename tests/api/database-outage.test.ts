import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { DEMO_PASSWORD, demoEmail, resetDatabase } from './helpers.ts';
import { apiTestEnv } from './test-env.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** A TCP relay in front of MariaDB that can be cut and restored, to play a database outage. */
function dbRelay(targetPort: number) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | undefined;
  let port = 0;
  const listen = () =>
    new Promise<number>((resolve) => {
      server = net.createServer((client) => {
        const upstream = net.connect(targetPort, '127.0.0.1');
        sockets.add(client).add(upstream);
        client.pipe(upstream).pipe(client);
        const drop = () => {
          client.destroy();
          upstream.destroy();
          sockets.delete(client);
          sockets.delete(upstream);
        };
        client.on('error', drop).on('close', drop);
        upstream.on('error', drop).on('close', drop);
      });
      server.listen(port, '127.0.0.1', () => {
        port = (server!.address() as net.AddressInfo).port;
        resolve(port);
      });
    });
  const cut = () =>
    new Promise<void>((resolve) => {
      sockets.forEach((s) => s.destroy());
      sockets.clear();
      server?.close(() => resolve());
    });
  return { listen, cut };
}

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

async function waitFor(check: () => Promise<boolean>, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  while (!(await check().catch(() => false))) {
    if (Date.now() > deadline) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 200));
  }
}

const relay = dbRelay(Number(apiTestEnv.DB_PORT));
let server: ChildProcess;
let base = '';

beforeAll(async () => {
  await resetDatabase();
  const dbPort = await relay.listen();
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  server = spawn(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/server.ts'], {
    cwd: root,
    env: { ...process.env, ...apiTestEnv, DB_PORT: String(dbPort), PORT: String(port), LOG_LEVEL: 'fatal' },
    stdio: 'ignore',
  });
  await waitFor(async () => (await fetch(`${base}/api/health`)).status === 200, 30_000);
}, 60_000);

afterAll(() => {
  server?.kill('SIGTERM');
});

describe('when MariaDB goes away and comes back', () => {
  it('answers 503 quickly while it is down and recovers without a restart, keeping the session', async () => {
    const agent = supertest.agent(base);
    const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
    await agent.post('/api/auth/login').set('x-csrf-token', csrf).send({ email: demoEmail.dispatcher, password: DEMO_PASSWORD }).expect(200);
    await agent.get('/api/auth/me').expect(200);

    await relay.cut();

    let started = Date.now();
    const health = await agent.get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toMatchObject({ database: 'down' });
    expect(Date.now() - started).toBeLessThan(6000);

    started = Date.now();
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(503);
    expect(me.body.error.code).toBe('UNAVAILABLE');
    expect(me.body.error.message).toMatch(/database is not answering/);
    expect(Date.now() - started).toBeLessThan(6000);

    await relay.listen();
    await waitFor(async () => (await agent.get('/api/health')).status === 200, 20_000);
    const back = await agent.get('/api/auth/me').expect(200);
    expect(back.body.user.email).toBe(demoEmail.dispatcher);
  }, 60_000);
});
