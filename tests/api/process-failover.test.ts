import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { QueryTypes } from 'sequelize';
import { Session, Site, User, sequelize } from '../../apps/api/src/models/index.ts';
import { DEMO_PASSWORD, demoEmail, resetDatabase, someoneWaits } from './helpers.ts';
import { apiTestEnv } from './test-env.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

type Api = { child: ChildProcess; base: string };
const running = new Set<ChildProcess>();

/**
 * The real server entry in its own process, on its own loopback port, on this slot's database. Node runs
 * it with tsx as a loader (not the tsx command, which forks the server as a second process: a SIGKILL
 * would then kill the wrapper and leave the server running).
 */
async function startApi(port: number, logLevel = 'fatal'): Promise<Api & { output: () => string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'apps/api/src/server.ts'], {
    cwd: root,
    env: { ...process.env, ...apiTestEnv, PORT: String(port), LOG_LEVEL: logLevel },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  running.add(child);
  child.once('exit', () => running.delete(child));
  const base = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  while (
    !(await fetch(`${base}/api/health`)
      .then((r) => r.ok)
      .catch(() => false))
  ) {
    if (child.exitCode !== null) throw new Error(`the API on port ${port} exited with ${child.exitCode}`);
    if (Date.now() > deadline) throw new Error(`the API on port ${port} did not start within 30 s`);
    await new Promise((r) => setTimeout(r, 150));
  }
  return { child, base, output: () => output };
}

/** A browser-like client: one session cookie, sent to whichever process it talks to. */
class Browser {
  cookie = '';
  csrf = '';
  async call(base: string, method: string, url: string, body?: unknown, csrf = this.csrf) {
    const headers: Record<string, string> = { cookie: this.cookie };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET' && csrf) headers['x-csrf-token'] = csrf;
    const res = await fetch(base + url, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('sf.sid='));
    if (set) this.cookie = set.split(';')[0]!;
    const text = await res.text();
    return { status: res.status, body: text ? (JSON.parse(text) as Record<string, unknown>) : {} };
  }
  async fetchCsrf(base: string) {
    const res = await this.call(base, 'GET', '/api/auth/csrf');
    expect(res.status).toBe(200);
    this.csrf = res.body.csrfToken as string;
  }
}

/** A browser signed in on `base`, holding the CSRF token of its session. */
async function signedIn(base: string, email: string): Promise<Browser> {
  const browser = new Browser();
  await browser.fetchCsrf(base);
  expect((await browser.call(base, 'POST', '/api/auth/login', { email, password: DEMO_PASSWORD })).status).toBe(200);
  await browser.fetchCsrf(base);
  return browser;
}

/** The body of a chunked HTTP/1.1 answer; throws unless it ends with the last (empty) chunk. */
function dechunked(raw: Buffer): string {
  const parts: Buffer[] = [];
  let at = 0;
  for (;;) {
    const eol = raw.indexOf('\r\n', at);
    if (eol < 0) throw new Error('the answer was cut off before its last chunk');
    const size = parseInt(raw.subarray(at, eol).toString('latin1'), 16);
    if (size === 0) return Buffer.concat(parts).toString('utf8');
    parts.push(raw.subarray(eol + 2, eol + 2 + size));
    at = eol + 2 + size + 2;
  }
}

const sidOf = (cookie: string) =>
  decodeURIComponent(cookie.slice('sf.sid='.length)).replace(/^s:/, '').split('.')[0]!;

let a: Api;
let b: Api;
let portA = 0;

beforeAll(async () => {
  await resetDatabase({ plant: true }); // tickets for the shutdown test's ticket pages
  portA = await freePort();
  [a, b] = await Promise.all([startApi(portA), freePort().then(startApi)]);
}, 60_000);

afterAll(async () => {
  await Promise.all(
    [...running].map(async (child) => {
      child.kill('SIGTERM');
      await once(child, 'exit');
    }),
  );
});

describe('two API processes sharing the session store', () => {
  it('keeps a session signed in on A working on B after A is killed, and a sign-out on B ends it everywhere', async () => {
    const browser = new Browser();
    await browser.fetchCsrf(a.base);
    const login = await browser.call(a.base, 'POST', '/api/auth/login', {
      email: demoEmail.dispatcher,
      password: DEMO_PASSWORD,
    });
    expect(login.status).toBe(200);
    await browser.fetchCsrf(a.base);
    expect((await browser.call(a.base, 'GET', '/api/auth/me')).status).toBe(200);

    // A dies without a chance to clean up; a replacement comes up on A's port meanwhile.
    a.child.kill('SIGKILL');
    await once(a.child, 'exit');
    await expect(fetch(`${a.base}/api/health`)).rejects.toThrow();
    const restarted = startApi(portA);

    const me = await browser.call(b.base, 'GET', '/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email: demoEmail.dispatcher, role: 'dispatcher' });

    // A write on B with the CSRF token that A handed out: the token lives in the shared session.
    const refused = await browser.call(
      b.base,
      'PUT',
      '/api/me/mail-preferences',
      { optOut: ['overdue'] },
      'not-the-token',
    );
    expect(refused.status).toBe(403);
    const saved = await browser.call(b.base, 'PUT', '/api/me/mail-preferences', { optOut: ['overdue'] });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ optOut: ['overdue'] });

    const a2 = await restarted;
    expect((await browser.call(a2.base, 'GET', '/api/auth/me')).status).toBe(200);
    expect((await browser.call(a2.base, 'GET', '/api/me/mail-preferences')).body).toMatchObject({
      optOut: ['overdue'],
    });

    const sid = sidOf(browser.cookie);
    expect(await Session.count({ where: { sid } })).toBe(1);
    const signedOutCookie = browser.cookie;
    expect((await browser.call(b.base, 'POST', '/api/auth/logout', {})).status).toBe(204);
    expect(await Session.count({ where: { sid } })).toBe(0);

    browser.cookie = signedOutCookie;
    const onB = await browser.call(b.base, 'GET', '/api/auth/me');
    expect(onB.status).toBe(401);
    expect((onB.body.error as { code: string }).code).toBe('UNAUTHENTICATED');
    browser.cookie = signedOutCookie;
    expect((await browser.call(a2.base, 'GET', '/api/auth/me')).status).toBe(401);
  }, 30_000);
});

/** A ticket at CBD on the string `label`, dispatched to the demo technician and started. */
async function ticketInTheField(base: string, dispatcher: Browser, tech: Browser, label: string) {
  const site = (await Site.findOne({ where: { code: 'CBD' } }))!;
  const strings = (await dispatcher.call(base, 'GET', `/api/sites/${site.id}/strings?q=${label}`)).body.items as Array<{ id: number }>;
  const techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  const created = await dispatcher.call(base, 'POST', '/api/work-orders', {
    siteId: site.id,
    strings: [{ stringId: strings[0]!.id, symptom: 'low current' }],
    faultCategory: 'shading_soiling',
    priority: 'P3',
    title: 'A download at shutdown',
    source: 'inspection',
    assigneeId: techId,
  });
  expect(created.status).toBe(201);
  const ticket = (created.body.items as Array<{ id: number; version: number }>)[0]!;
  expect((await tech.call(base, 'POST', `/api/work-orders/${ticket.id}/transitions`, { to: 'in_field', version: ticket.version })).status).toBe(200);
  return { ticket, stringId: strings[0]!.id, siteId: site.id };
}

/** The exit code of a child process, whether it has exited already or does later. */
function exitOf(child: ChildProcess): Promise<number | null> {
  if (child.exitCode !== null) return Promise.resolve(child.exitCode);
  return once(child, 'exit').then(([code]) => code as number | null);
}

/**
 * Asks `url` (uncompressed) on a raw connection, pauses reading after the first bytes, sends the process
 * SIGTERM and waits until it has begun to drain (it takes no new connection then).
 */
async function downloadPausedAtStop(api: Api, url: string, cookie: string) {
  const socket = net.connect(Number(new URL(api.base).port), '127.0.0.1');
  socket.on('error', () => {});
  const chunks: Buffer[] = [];
  socket.on('data', (chunk: Buffer) => chunks.push(chunk));
  socket.write(`GET ${url} HTTP/1.1\r\nHost: 127.0.0.1\r\nCookie: ${cookie}\r\nAccept-Encoding: identity\r\n\r\n`);
  await once(socket, 'data');
  socket.pause();
  api.child.kill('SIGTERM');
  await expect
    .poll(() => fetch(`${api.base}/api/health`).then(() => 'still listening', () => 'draining'), { timeout: 5_000 })
    .toBe('draining');
  return { socket, chunks };
}

/** Reads a paused socket slowly to its close, a burst every 40 ms; resolves when it closes. */
async function readSlowlyToClose(socket: net.Socket): Promise<void> {
  const slowly = setInterval(() => {
    socket.resume();
    setTimeout(() => socket.pause(), 2);
  }, 40);
  await once(socket, 'close');
  clearInterval(slowly);
}

describe('a process told to stop (SIGTERM)', () => {
  it('lets the handlers of clients that hung up finish before it closes its database pool', async () => {
    const c = await startApi(await freePort(), 'warn');
    const browser = await signedIn(c.base, demoEmail.dispatcher);
    const { port } = new URL(c.base);
    const ticket = (await browser.call(c.base, 'GET', '/api/work-orders?pageSize=1')).body.items as Array<{ id: number }>;
    // 100 ticket pages at once (several queries each, more requests than the pool's 10 connections), each
    // client gone before its answer.
    const sockets = Array.from({ length: 100 }, (_, i) => {
      const socket = net.connect(Number(port), '127.0.0.1');
      socket.on('error', () => {});
      socket.write(
        `GET ${i % 2 ? `/api/work-orders/${ticket[0]!.id}` : '/api/work-orders?pageSize=100'} HTTP/1.1\r\nHost: 127.0.0.1\r\nCookie: ${browser.cookie}\r\n\r\n`,
      );
      return socket;
    });
    await new Promise((r) => setTimeout(r, 20));
    for (const socket of sockets) socket.destroy();
    c.child.kill('SIGTERM');
    const [code] = (await once(c.child, 'exit')) as [number | null];
    // Before: the pool closed under the running handlers ("…called after the connection manager was
    // closed", logged as unhandled errors) — here every handler ended cleanly and the process exits 0.
    expect(c.output()).not.toMatch(/connection manager was closed|"level":50/);
    expect(code).toBe(0);
  }, 30_000);

  it('answers a request it was handling with Connection: close and takes no further request on that connection', async () => {
    const c = await startApi(await freePort(), 'warn');
    const browser = await signedIn(c.base, demoEmail.supervisor);
    // The request is held in the database (its user row locked here) until the process has been told to stop.
    const user = (await User.findOne({ where: { email: demoEmail.supervisor } }))!;
    const t = await sequelize.transaction();
    await User.findByPk(user.id, { transaction: t, lock: t.LOCK.UPDATE });
    const { port } = new URL(c.base);
    const socket = net.connect(Number(port), '127.0.0.1');
    let received = '';
    socket.on('data', (chunk: Buffer) => (received += chunk.toString()));
    socket.on('error', () => {});
    const body = JSON.stringify({ optOut: [] });
    // Two requests on one keep-alive connection: the second is already waiting when the first is answered.
    socket.write(
      `PUT /api/me/mail-preferences HTTP/1.1\r\nHost: 127.0.0.1\r\nCookie: ${browser.cookie}\r\nx-csrf-token: ${browser.csrf}\r\n` +
        `Content-Type: application/json\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n${body}` +
        `GET /api/health HTTP/1.1\r\nHost: 127.0.0.1\r\n\r\n`,
    );
    await someoneWaits(t, /UPDATE `users`/);
    c.child.kill('SIGTERM');
    // Released once the process has begun to drain: it takes no new connection then.
    await expect
      .poll(() => fetch(`${c.base}/api/health`).then(() => 'still listening', () => 'draining'), { timeout: 10_000 })
      .toBe('draining');
    await t.rollback();
    await once(socket, 'close');
    const [code] = (await once(c.child, 'exit')) as [number | null];
    expect(received).toMatch(/^HTTP\/1\.1 200/);
    expect(received).toMatch(/\r\nConnection: close\r\n/i);
    // Before: the connection stayed open after server.close() and the health check was answered too.
    expect(received.match(/HTTP\/1\.1 \d{3}/g)).toHaveLength(1);
    expect(code).toBe(0);
  }, 30_000);

  it('sends a long download to the end to a client that reads it slowly, then exits', async () => {
    const c = await startApi(await freePort(), 'warn');
    const [dispatcher, tech, admin] = await Promise.all([
      signedIn(c.base, demoEmail.dispatcher),
      signedIn(c.base, demoEmail.technician),
      signedIn(c.base, demoEmail.admin),
    ]);
    // A check on a ticket of its own, then 30,000 copies of it: a CSV of several megabytes, far more than
    // the socket buffers hold, so the answer is still being written when the process is told to stop.
    const { ticket, stringId, siteId } = await ticketInTheField(c.base, dispatcher, tech, 'INV04-MPPT1');
    const check = await tech.call(c.base, 'POST', `/api/work-orders/${ticket.id}/checks`, {
      clientId: randomUUID(), stringId, phase: 'before', takenAt: new Date().toISOString(), vocV: 690, iscA: 9.1,
      irradianceWm2: 900, irradianceMethod: 'reference_cell', moduleTempC: 40, moduleTempMethod: 'back_sensor', polarityCorrect: true,
    });
    expect(check.status).toBe(201);
    const [{ c: cols }] = await sequelize.query<{ c: string }>(
      "SELECT GROUP_CONCAT(column_name ORDER BY ordinal_position) AS c FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'string_checks' AND column_name NOT IN ('id', 'client_id')",
      { type: QueryTypes.SELECT },
    ) as [{ c: string }];
    await sequelize.query(`INSERT INTO string_checks (client_id, ${cols}) SELECT UUID(), ${cols} FROM string_checks, seq_1_to_30000 WHERE id = ${Number(check.body.id)}`);
    try {
      const day = new Date().toISOString().slice(0, 10);
      const url = `/api/fleet/exports/checks.csv?siteId=${siteId}&from=2026-01-01&to=${day}`;
      const whole = await (await fetch(c.base + url, { headers: { cookie: admin.cookie } })).text();
      const lines = whole.trim().split(/\r?\n/).length;
      expect(lines).toBeGreaterThan(30_000);

      // Uncompressed, so the rows cannot all sit in zlib's buffers.
      const { socket, chunks } = await downloadPausedAtStop(c, url, admin.cookie);
      // Read slowly to the end, a burst every 40 ms: the handler ends the answer while its tail still waits
      // in the process's buffers, and the connection must stay open until that tail is out.
      let completeAt = 0;
      socket.on('data', () => {
        if (!completeAt && Buffer.concat(chunks.slice(-2)).toString('latin1').endsWith('\r\n0\r\n\r\n')) completeAt = Date.now();
      });
      await readSlowlyToClose(socket);
      const closedAt = Date.now();
      const [code] = (await once(c.child, 'exit')) as [number | null];
      expect(completeAt, 'the last chunk arrived').toBeGreaterThan(0);
      // Its headers went out keep-alive before the drain: the connection is ended once the answer is out,
      // not left open to the 7 s deadline.
      expect(closedAt - completeAt).toBeLessThan(1_500);
      const received = Buffer.concat(chunks);
      expect(received.toString('latin1')).toMatch(/^HTTP\/1\.1 200/);
      // Chunked to its last chunk, with every line of the download read in one go before.
      const body = dechunked(received.subarray(received.indexOf('\r\n\r\n') + 4));
      expect(body.trim().split(/\r?\n/).length).toBe(lines);
      expect(code).toBe(0);
    } finally {
      await sequelize.query(`DELETE FROM string_checks WHERE work_order_id = ${ticket.id}`);
    }
  }, 60_000);

  it('sends a large photo, written in one piece, to the end to a reader paused when the process stops', async () => {
    const c = await startApi(await freePort(), 'warn');
    const [dispatcher, tech] = await Promise.all([signedIn(c.base, demoEmail.dispatcher), signedIn(c.base, demoEmail.technician)]);
    const { ticket, stringId } = await ticketInTheField(c.base, dispatcher, tech, 'INV04-MPPT2');
    // Noise compresses badly: a JPEG of several megabytes, which the API answers with one write.
    const img = await sharp({ create: { width: 2400, height: 1800, channels: 3, background: '#888', noise: { type: 'gaussian', mean: 128, sigma: 60 } } })
      .jpeg({ quality: 95 })
      .toBuffer();
    const form = new FormData();
    form.append('meta', JSON.stringify([{ tag: 'before', stringId }]));
    form.append('files', new Blob([img], { type: 'image/jpeg' }), 'noise.jpg');
    const uploaded = await fetch(`${c.base}/api/work-orders/${ticket.id}/photos`, { method: 'POST', headers: { cookie: tech.cookie, 'x-csrf-token': tech.csrf }, body: form });
    expect(uploaded.status).toBe(201);
    const photoId = ((await uploaded.json()) as { items: Array<{ id: number }> }).items[0]!.id;
    const url = `/api/photos/${photoId}/original`;
    const size = (await (await fetch(c.base + url, { headers: { cookie: tech.cookie } })).arrayBuffer()).byteLength;
    expect(size).toBeGreaterThan(3_000_000);

    const { socket, chunks } = await downloadPausedAtStop(c, url, tech.cookie);
    // Past the point where the process stops waiting for handlers (this one ended its answer at once): a
    // connection closed now would lose what is still in the process's buffers.
    await new Promise((r) => setTimeout(r, 800));
    const exited = exitOf(c.child);
    await readSlowlyToClose(socket);
    const code = await exited;
    const received = Buffer.concat(chunks);
    const headEnd = received.indexOf('\r\n\r\n');
    expect(received.subarray(0, headEnd).toString('latin1')).toMatch(new RegExp(`^HTTP/1\\.1 200[\\s\\S]*\\r\\ncontent-length: ${size}`, 'i'));
    expect(received.length - headEnd - 4).toBe(size);
    expect(code).toBe(0);
  }, 60_000);
});
