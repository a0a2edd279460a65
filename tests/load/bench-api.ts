// npm run bench:api — API figures against the scale data set (run `npm run seed:scale` first; it seeds
// automatically when the bench database is empty). Loopback only, bounded in count and time.
import { spawn, execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import mariadb from 'mariadb';
import sharp from 'sharp';
import { seedScale, benchDb } from './seed-scale.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const port = Number(process.env.BENCH_PORT ?? 8095);
const base = `http://127.0.0.1:${port}`;
const dbPort = Number(process.env.DB_PORT ?? 3307);
const out: string[] = [];
const say = (line: string) => {
  out.push(line);
  process.stdout.write(`${line}\n`);
};

function stats(ms: number[]) {
  const s = [...ms].sort((a, b) => a - b);
  const at = (p: number) => s[Math.min(s.length - 1, Math.floor(p * s.length))]!;
  return { median: at(0.5), p95: at(0.95), p99: at(0.99), n: s.length };
}
const fmt = (x: number) => `${x.toFixed(1)} ms`;

class Client {
  cookie = '';
  csrf = '';
  async request(method: string, url: string, body?: unknown, extraHeaders: Record<string, string> = {}) {
    const headers: Record<string, string> = { cookie: this.cookie, ...extraHeaders };
    if (body !== undefined && !(body instanceof FormData)) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    const res = await fetch(base + url, { method, headers, body: body instanceof FormData ? body : body === undefined ? undefined : JSON.stringify(body) });
    const set = res.headers.getSetCookie().find((c) => c.startsWith('sf.sid='));
    if (set) this.cookie = set.split(';')[0]!;
    return res;
  }
  async signIn(email: string) {
    this.csrf = ((await (await this.request('GET', '/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
    const res = await this.request('POST', '/api/auth/login', { email, password: 'stringfield-demo' });
    if (!res.ok) throw new Error(`sign-in failed: ${res.status}`);
    this.csrf = ((await (await this.request('GET', '/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  }
}

async function time(n: number, fn: () => Promise<unknown>) {
  const ms: number[] = [];
  for (let i = 0; i < n; i += 1) {
    const t = performance.now();
    await fn();
    ms.push(performance.now() - t);
  }
  return stats(ms);
}

function rssOfTree(pid: number): number {
  let total = 0;
  const walk = (p: number) => {
    try {
      const status = fs.readFileSync(`/proc/${p}/status`, 'utf8');
      total += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) * 1024;
      const kids = fs.readFileSync(`/proc/${p}/task/${p}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number);
      kids.forEach(walk);
    } catch {
      /* gone */
    }
  };
  walk(pid);
  return total;
}

async function main() {
  const conn = await mariadb.createConnection({ host: '127.0.0.1', port: dbPort, user: 'stringfield', password: process.env.DB_PASSWORD ?? 'stringfield-local', database: benchDb, bigIntAsNumber: true }).catch(() => null);
  let ready = false;
  if (conn) {
    const rows = (await conn.query('SELECT COUNT(*) AS n FROM work_orders').catch(() => [{ n: 0 }])) as Array<{ n: number }>;
    ready = Number(rows[0]?.n ?? 0) >= 100_000;
    await conn.end();
  }
  if (!ready) await seedScale();

  const server = spawn(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/server.ts'], {
    cwd: root,
    env: { ...process.env, NODE_ENV: 'production', SESSION_SECRET: 'stringfield-benchmark-session-secret-0123456789', DB_NAME: benchDb, PORT: String(port), LOG_LEVEL: 'warn', SMTP_URL: 'smtp://127.0.0.1:1', UPLOADS_DIR: path.join(root, '.data/uploads-bench'), LOGIN_RATE_LIMIT: '1000' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  try {
    const deadline = Date.now() + 60_000;
    while (!(await fetch(`${base}/api/health`).then((r) => r.ok).catch(() => false))) {
      if (Date.now() > deadline) throw new Error('API did not start');
      await new Promise((r) => setTimeout(r, 300));
    }
    say(`Stringfield API benchmark — ${new Date().toISOString()} — ${process.platform} ${process.arch}, Node ${process.version}, ${(await import('node:os')).cpus().length} cores`);
    const dispatcher = new Client();
    await dispatcher.signIn('dispatcher@stringfield.test');

    const board = '/api/work-orders?status=dispatched,in_field&priority=P2&page=1&pageSize=25&sort=dueAt';
    await time(5, () => dispatcher.request('GET', board).then((r) => r.arrayBuffer()));
    const b = await time(60, () => dispatcher.request('GET', board).then((r) => r.arrayBuffer()));
    say(`board, first page, two filters (100,000 tickets): median ${fmt(b.median)}, p95 ${fmt(b.p95)} (target median < 50 ms)`);

    // The same page as one raw SQL statement through the mariadb driver, for the ORM overhead ratio.
    const raw = await mariadb.createConnection({ host: '127.0.0.1', port: dbPort, user: 'stringfield', password: process.env.DB_PASSWORD ?? 'stringfield-local', database: benchDb });
    const rawSql = `SELECT w.id, w.number, w.title, w.status, w.priority, w.fault_category, w.reported_at, w.due_at, w.version, s.id AS site_id, s.code, s.name, s.time_zone, u.id AS assignee_id, u.name AS assignee,
                       (SELECT COUNT(*) FROM work_orders w2 WHERE w2.status IN ('dispatched','in_field') AND w2.priority = 'P2') AS total,
                       (SELECT GROUP_CONCAT(p.label ORDER BY p.label) FROM work_order_strings ws JOIN pv_strings p ON p.id = ws.string_id WHERE ws.work_order_id = w.id) AS labels
                  FROM work_orders w JOIN sites s ON s.id = w.site_id LEFT JOIN users u ON u.id = w.assignee_id
                 WHERE w.status IN ('dispatched','in_field') AND w.priority = 'P2' ORDER BY w.due_at, w.id LIMIT 25`;
    await time(5, () => raw.query(rawSql));
    const r = await time(60, () => raw.query(rawSql));
    await raw.end();
    say(`  same page as one raw SQL statement: median ${fmt(r.median)}; API / raw = ${(b.median / r.median).toFixed(2)}× (includes HTTP, session, JSON)`);

    const list = (await (await dispatcher.request('GET', '/api/work-orders?pageSize=1&status=in_field')).json()) as { items: Array<{ id: number }> };
    const ticketId = list.items[0]!.id;
    const t = await time(40, () => dispatcher.request('GET', `/api/work-orders/${ticketId}`).then((x) => x.arrayBuffer()));
    say(`ticket page: median ${fmt(t.median)}, p95 ${fmt(t.p95)}`);

    const today = new Date().toISOString().slice(0, 10);
    const from90 = new Date(Date.now() - 90 * 86_400_000).toISOString().slice(0, 10);
    const from365 = new Date(Date.now() - 365 * 86_400_000).toISOString().slice(0, 10);
    const m = await time(20, () => dispatcher.request('GET', `/api/fleet/metrics?from=${from90}&to=${today}`).then((x) => x.arrayBuffer()));
    say(`metrics, whole fleet, 90 days (100,000 tickets, 1,000,000 checks): median ${fmt(m.median)}, p95 ${fmt(m.p95)} (target median < 200 ms)`);
    const sites = (await (await dispatcher.request('GET', '/api/sites?q=Scale%20Field&pageSize=1')).json()) as { items: Array<{ id: number; code: string }> };
    const site = sites.items[0]!;
    const ms = await time(20, () => dispatcher.request('GET', `/api/fleet/metrics?siteId=${site.id}&from=${from365}&to=${today}`).then((x) => x.arrayBuffer()));
    say(`metrics, one site, 365 days: median ${fmt(ms.median)}`);
    const h = await time(20, () => dispatcher.request('GET', `/api/fleet/sites/${site.id}/health-map`).then((x) => x.arrayBuffer()));
    say(`health map, 400 strings with 20,000 checks behind them: median ${fmt(h.median)}`);

    // Export: stream a year of checks for one site and watch the server's memory.
    let peak = 0;
    const before = rssOfTree(server.pid!);
    const sampler = setInterval(() => (peak = Math.max(peak, rssOfTree(server.pid!))), 50);
    const t0 = performance.now();
    const res = await dispatcher.request('GET', `/api/fleet/exports/checks.csv?siteId=${site.id}&from=${from365}&to=${today}`);
    let bytes = 0;
    let lines = 0;
    for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
      bytes += chunk.length;
      for (const c of chunk) if (c === 10) lines += 1;
    }
    clearInterval(sampler);
    say(`checks CSV export, one site, 365 days: ${lines - 1} rows, ${(bytes / 1e6).toFixed(1)} MB in ${fmt(performance.now() - t0)}; server RSS ${(before / 1e6).toFixed(0)} MB before, peak ${(peak / 1e6).toFixed(0)} MB`);

    // Layout import: 5,000 rows into a fresh site of the scale fleet.
    const target = (await (await dispatcher.request('GET', '/api/sites?q=Z050&pageSize=1')).json()) as { items: Array<{ id: number }> };
    const inverters = (await (await dispatcher.request('GET', `/api/inverters?siteId=${target.items[0]!.id}`)).json()) as Array<{ tag: string }>;
    const rows = ['label,inverter,mppt_input,module_model,modules_in_series'];
    for (let i = 0; i < 5000; i += 1) rows.push(`IMP${Date.now().toString(36)}-${String(i).padStart(5, '0')},${inverters[i % inverters.length]!.tag},${1 + (i % 6)},SDM-405-72M,25`);
    const csv = new Blob([rows.join('\n')], { type: 'text/csv' });
    for (const mode of ['dry-run', 'commit'] as const) {
      const form = new FormData();
      form.append('file', csv, 'layout.csv');
      const ti = performance.now();
      const ir = await dispatcher.request('POST', `/api/sites/${target.items[0]!.id}/import?mode=${mode}`, form);
      const body = (await ir.json()) as { validRows?: number; committed?: boolean; error?: { message: string } };
      say(`layout import, 5,000 rows, ${mode}: ${fmt(performance.now() - ti)} (status ${ir.status}, valid ${body.validRows ?? '?'}${body.error ? `, ${body.error.message}` : ''}) (target < 10 s)`);
    }

    // Photos: a 12-megapixel JPEG through the upload pipeline (checks, EXIF, re-encode, two sizes), in this process.
    const photo = await sharp({ create: { width: 4000, height: 3000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 20 } } }).jpeg({ quality: 90 }).toBuffer();
    const { processImage } = await import('../../apps/api/src/services/evidence.service.ts');
    const process12 = () => processImage({ originalname: 'bench.jpg', buffer: photo, mimetype: 'image/jpeg' }, { tag: 'other', stringId: null, modulePosition: null, caption: '' }, 0);
    await process12();
    const rssBefore = process.memoryUsage().rss;
    let rssPeak = rssBefore;
    const s2 = setInterval(() => (rssPeak = Math.max(rssPeak, process.memoryUsage().rss)), 10);
    const p = await time(10, process12);
    clearInterval(s2);
    say(`12-megapixel JPEG (${(photo.length / 1e6).toFixed(1)} MB) through the photo pipeline (screen + thumbnail): median ${fmt(p.median)}, p95 ${fmt(p.p95)}; RSS peak ${(rssPeak / 1e6).toFixed(0)} MB (process total) (targets < 400 ms, < 300 MB)`);

    // Ten concurrent uploads of that photo by the technician of an in-field demo ticket.
    const tech = new Client();
    await tech.signIn('tech@stringfield.test');
    const mine = (await (await tech.request('GET', '/api/work-orders?assigneeId=me&status=in_field&pageSize=1')).json()) as { items: Array<{ id: number }> };
    if (mine.items[0]) {
      const tu = performance.now();
      const results = await Promise.all(
        Array.from({ length: 10 }, () => {
          const form = new FormData();
          form.append('meta', JSON.stringify([{ tag: 'other' }]));
          form.append('files', new Blob([photo], { type: 'image/jpeg' }), 'bench.jpg');
          return tech.request('POST', `/api/work-orders/${mine.items[0]!.id}/photos`, form).then((x) => x.status);
        }),
      );
      say(`10 concurrent 12-MP uploads: ${results.filter((s) => s === 201).length}/10 succeeded in ${fmt(performance.now() - tu)}`);
    }
    fs.mkdirSync(path.join(root, '.data/reports'), { recursive: true });
    fs.writeFileSync(path.join(root, '.data/reports/bench-api.txt'), `${out.join('\n')}\n`);
  } finally {
    server.kill('SIGTERM');
  }
}

await main();
void execFileSync;
