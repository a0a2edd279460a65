// What the benchmarks share: timing statistics, memory of a process tree, an API server of our own, and a
// cookie-keeping HTTP client that signs in the way the web app does (CSRF token first).
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const tsx = path.join(root, 'node_modules/.bin/tsx');

export function stats(ms: number[]) {
  const s = [...ms].sort((a, b) => a - b);
  const at = (p: number) => s[Math.min(s.length - 1, Math.floor(p * s.length))]!;
  return { median: at(0.5), p95: at(0.95), p99: at(0.99), n: s.length };
}

/** Resident memory (VmRSS) of a process and all its children, in bytes. */
export function rssOfTree(pid: number): number {
  let total = 0;
  const walk = (p: number) => {
    try {
      total += Number(/VmRSS:\s+(\d+)/.exec(fs.readFileSync(`/proc/${p}/status`, 'utf8'))?.[1] ?? 0) * 1024;
      fs.readFileSync(`/proc/${p}/task/${p}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number).forEach(walk);
    } catch {
      /* gone */
    }
  };
  walk(pid);
  return total;
}

/** A free loopback port: a fixed one may already serve someone else's API, and a bench would measure that. */
export function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/** Starts `apps/api/src/server.ts` (or another `script` serving the app) with `env` on top of this process's and waits for /api/health. */
export async function startApi(port: number, env: Record<string, string>, script = 'apps/api/src/server.ts'): Promise<ChildProcess> {
  const server = spawn(tsx, [script], {
    cwd: root,
    env: { MALLOC_ARENA_MAX: '2', ...process.env, NODE_ENV: 'production', SESSION_SECRET: 'stringfield-benchmark-session-secret-0123456789', LOG_LEVEL: 'warn', SMTP_URL: 'smtp://127.0.0.1:1', ...env, PORT: String(port) },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const deadline = Date.now() + 60_000;
  while (!(await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false))) {
    if (server.exitCode !== null) throw new Error(`the API exited (code ${server.exitCode}); is port ${port} taken?`);
    if (Date.now() > deadline) {
      server.kill('SIGTERM');
      throw new Error('API did not start');
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  return server;
}

/** A signed-in HTTP client of one demo user: keeps the session cookie and the CSRF token. */
export class Client {
  cookie = '';
  csrf = '';
  constructor(private readonly base: string) {}

  async request(method: string, url: string, body?: unknown, extraHeaders: Record<string, string> = {}) {
    const headers: Record<string, string> = { cookie: this.cookie, ...extraHeaders };
    if (body !== undefined && !(body instanceof FormData)) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    const res = await fetch(this.base + url, { method, headers, body: body instanceof FormData ? body : body === undefined ? undefined : JSON.stringify(body) });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('sf.sid='));
    if (set) this.cookie = set.split(';')[0]!;
    return res;
  }

  private async refreshCsrf() {
    this.csrf = ((await (await this.request('GET', '/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  }

  async signIn(email: string, password = 'stringfield-demo') {
    await this.refreshCsrf();
    const res = await this.request('POST', '/api/auth/login', { email, password });
    if (!res.ok) throw new Error(`sign-in of ${email} failed: ${res.status}`);
    await this.refreshCsrf(); // the session id, and so the token, changes at sign-in
  }
}
