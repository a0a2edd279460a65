// npm run bench:api — API figures against the scale data set (run `npm run seed:scale` first; it seeds
// automatically when the bench database is empty). Loopback only, bounded in count and time (about two
// minutes besides seeding: four load runs of 20 s and the single-client timings).
// The photo pipeline has its own bench (tests/load/bench-photo.ts).
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import mariadb from 'mariadb';
import { seedScale, benchDb } from './seed-scale.ts';
import { Client, freePort, root, rssOfTree, startApi, stats } from './lib.ts';

const port = process.env.BENCH_PORT ? Number(process.env.BENCH_PORT) : await freePort();
const base = `http://127.0.0.1:${port}`;
const dbPort = Number(process.env.DB_PORT ?? 3307);
const dbPassword = process.env.DB_PASSWORD ?? 'stringfield-local';
const loadSeconds = Number(process.env.BENCH_LOAD_SECONDS ?? 20);
const connections = 32;
const readWarmUpSeconds = 3;
const signInAccounts = 32;
const benchNote = 'autocannon bench check';
const out: string[] = [];
// The machine is shared: every figure carries the 1-minute load average at the time it was taken.
const load = () => `load ${os.loadavg()[0]!.toFixed(2)}`;
const say = (line: string) => {
  out.push(line);
  process.stdout.write(`${line}\n`);
};

const fmt = (x: number) => `${x.toFixed(1)} ms`;

async function time(n: number, fn: () => Promise<unknown>) {
  const ms: number[] = [];
  for (let i = 0; i < n; i += 1) {
    const t = performance.now();
    await fn();
    ms.push(performance.now() - t);
  }
  return stats(ms);
}

/**
 * 32 connections for `loadSeconds`; the figures autocannon reports, on one line. With `warmUpSeconds`, the
 * same requests run that long first and are not counted: the first seconds under load measure the JIT
 * and the pool filling up, not the steady state the targets are about (a read route's cold run reads
 * about 20 % fewer requests a second here). Writes are not warmed up, so every row they add is counted.
 */
async function loadRun(
  label: string,
  opts: Omit<autocannon.Options, 'url' | 'connections' | 'duration'>,
  target = '',
  seconds = loadSeconds,
  warmUpSeconds = 0,
) {
  if (warmUpSeconds > 0) await autocannon({ url: base, connections, duration: warmUpSeconds, ...opts });
  const result = await autocannon({ url: base, connections, duration: seconds, ...opts });
  const codes = Object.entries(result.statusCodeStats ?? {})
    .map(([code, v]) => `${code}×${v.count ?? 0}`)
    .join(' ');
  say(
    `${label}: ${result.requests.average.toFixed(0)} req/s, p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, ` +
      `non-2xx ${result.non2xx}, errors ${result.errors} (timeouts ${result.timeouts}) [${codes}]${target} (${load()})`,
  );
  return result;
}

function setCookieOf(headers: Record<string, string | string[]>): string | undefined {
  const key = Object.keys(headers).find((k) => k.toLowerCase() === 'set-cookie');
  const values = ([] as string[]).concat(key ? (headers[key] ?? []) : []);
  return values.find((c) => c.startsWith('sf.sid='))?.split(';')[0];
}

async function main() {
  const connect = () =>
    mariadb.createConnection({
      host: '127.0.0.1',
      port: dbPort,
      user: 'stringfield',
      password: dbPassword,
      database: benchDb,
      bigIntAsNumber: true,
    });
  const conn = await connect().catch(() => null);
  let ready = false;
  if (conn) {
    const rows = (await conn
      .query('SELECT COUNT(*) AS n FROM work_orders')
      .catch(() => [{ n: 0 }])) as Array<{ n: number }>;
    ready = Number(rows[0]?.n ?? 0) >= 100_000;
    await conn.end();
  }
  if (!ready) await seedScale();
  // A bench database seeded before the latest migrations gets them (indexes above all).
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/cli/migrate.ts', 'up'], {
    cwd: root,
    env: { ...process.env, DB_NAME: benchDb, LOG_LEVEL: 'warn' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });

  // Sign-in load uses one account per connection: the limiter counts an attempt from the moment it
  // starts (and forgives it once it succeeds), so 32 sign-ins of one account in flight at once would
  // look like guessing. The accounts are owners of no site: signing in is all they do.
  const db = await connect();
  await db.query(
    `INSERT IGNORE INTO users (email, name, role, password_hash, is_active, is_demo, created_at, updated_at, mail_opt_out)
     SELECT CONCAT('bench-signin-', LPAD(seq, 2, '0'), '@stringfield.test'), CONCAT('Bench sign-in ', seq), 'owner',
            password_hash, 1, 0, NOW(), NOW(), ''
       FROM users, seq_1_to_${signInAccounts} WHERE email = 'tech@stringfield.test'`,
  );
  await db.query("DELETE FROM rate_limit_hits WHERE `key` LIKE 'login:%'");

  const server = await startApi(port, { DB_NAME: benchDb, UPLOADS_DIR: path.join(root, '.data/uploads-bench') });
  try {
    say(
      `Stringfield API benchmark — ${new Date().toISOString()} — ${process.platform} ${process.arch}, Node ${process.version}, ${os.cpus().length} cores (${load()} at start)`,
    );
    const dispatcher = new Client(base);
    await dispatcher.signIn('dispatcher@stringfield.test');

    // ---- one client at a time ----
    const board = '/api/work-orders?status=dispatched,in_field&priority=P2&page=1&pageSize=25&sort=dueAt';
    await time(10, () => dispatcher.request('GET', board).then((r) => r.arrayBuffer()));
    const b = await time(100, () => dispatcher.request('GET', board).then((r) => r.arrayBuffer()));
    say(
      `board, first page, two filters (100,000 tickets): median ${fmt(b.median)}, p95 ${fmt(b.p95)} (target median < 50 ms) (${load()})`,
    );

    // The same page as one raw SQL statement through the mariadb driver, for the overhead ratio.
    const raw = await connect();
    const rawSql = `SELECT w.id, w.number, w.title, w.status, w.priority, w.fault_category, w.reported_at, w.due_at, w.version, s.id AS site_id, s.code, s.name, s.time_zone, u.id AS assignee_id, u.name AS assignee,
                       (SELECT COUNT(*) FROM work_orders w2 WHERE w2.status IN ('dispatched','in_field') AND w2.priority = 'P2') AS total,
                       (SELECT GROUP_CONCAT(p.label ORDER BY p.label) FROM work_order_strings ws JOIN pv_strings p ON p.id = ws.string_id WHERE ws.work_order_id = w.id) AS labels
                  FROM work_orders w JOIN sites s ON s.id = w.site_id LEFT JOIN users u ON u.id = w.assignee_id
                 WHERE w.status IN ('dispatched','in_field') AND w.priority = 'P2' ORDER BY w.due_at, w.id LIMIT 25`;
    await time(10, () => raw.query(rawSql));
    const r = await time(100, () => raw.query(rawSql));
    await raw.end();
    say(
      `  same page as one raw SQL statement: median ${fmt(r.median)}; API / raw = ${(b.median / r.median).toFixed(2)}× (a whole HTTP request against a statement in this process; the 1.5× target is read on the like-for-like ratio below) (${load()})`,
    );
    // The same statement behind a bare node:http server (driver pool, JSON, no framework, no session), asked
    // by the same client: what HTTP itself costs, so that the API's own share can be read off.
    const pool = mariadb.createPool({ host: '127.0.0.1', port: dbPort, user: 'stringfield', password: dbPassword, database: benchDb, bigIntAsNumber: true, connectionLimit: 4 });
    const bare = http.createServer((_req, res) => {
      pool.query(rawSql).then(
        (rows: unknown) => {
          const body = JSON.stringify(rows);
          res.writeHead(200, { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) });
          res.end(body);
        },
        () => res.writeHead(500).end(),
      );
    });
    await new Promise<void>((resolve) => bare.listen(0, '127.0.0.1', resolve));
    const bareUrl = `http://127.0.0.1:${(bare.address() as AddressInfo).port}/`;
    await time(10, () => fetch(bareUrl).then((x) => x.arrayBuffer()));
    const rh = await time(100, () => fetch(bareUrl).then((x) => x.arrayBuffer()));
    await new Promise((resolve) => bare.close(resolve));
    await pool.end();
    say(
      `  same statement behind a bare node:http server: median ${fmt(rh.median)}; API / bare HTTP = ${(b.median / rh.median).toFixed(2)}× (${load()})`,
    );

    // Like for like: the board route and the same page from one raw statement through the driver, both
    // behind the API's own stack in one process (tests/load/raw-board-server.ts), asked by the same client
    // one at a time, alternating, and then under load. This is the ratio that says whether the ORM layer is
    // the bottleneck; the figures above also count HTTP, the session and gzip on one side only.
    const harnessPort = await freePort();
    const harness = await startApi(
      harnessPort,
      { DB_NAME: benchDb, UPLOADS_DIR: path.join(root, '.data/uploads-bench') },
      'tests/load/raw-board-server.ts',
    );
    try {
      const harnessBase = `http://127.0.0.1:${harnessPort}`;
      const viaHarness = new Client(harnessBase);
      await viaHarness.signIn('dispatcher@stringfield.test');
      const rawBoard = board.replace('/api/work-orders', '/api/bench/raw-board');
      const [ormBody, rawBody] = await Promise.all(
        [board, rawBoard].map((u) => viaHarness.request('GET', u).then((x) => x.json())),
      );
      const same = JSON.stringify(ormBody) === JSON.stringify(rawBody);
      const ormMs: number[] = [];
      const rawMs: number[] = [];
      for (let i = 0; i < 220; i += 1) {
        for (const [u, into] of [
          [board, ormMs],
          [rawBoard, rawMs],
        ] as const) {
          const t = performance.now();
          await viaHarness.request('GET', u).then((x) => x.arrayBuffer());
          if (i >= 20) into.push(performance.now() - t);
        }
      }
      const o = stats(ormMs);
      const w = stats(rawMs);
      say(
        `  like for like, one process, same stack (session, gzip, zod, JSON), ${o.n} requests each, alternating: board route median ${fmt(o.median)}, raw-statement route ${fmt(w.median)}; ` +
          `board / raw = ${(o.median / w.median).toFixed(2)}× (target ≤ 1.5×); same response body: ${same ? 'yes' : 'NO'} (${load()})`,
      );
      const likeSeconds = Math.min(loadSeconds, 10);
      // Both routes warmed up under the same load first, so the one measured first is not the colder one.
      for (const u of [board, rawBoard])
        await autocannon({ url: harnessBase + u, connections, duration: readWarmUpSeconds, headers: { cookie: viaHarness.cookie } });
      const lo = await autocannon({ url: harnessBase + board, connections, duration: likeSeconds, headers: { cookie: viaHarness.cookie } });
      const lw = await autocannon({ url: harnessBase + rawBoard, connections, duration: likeSeconds, headers: { cookie: viaHarness.cookie } });
      say(
        `  like for like under load (${connections} connections, ${likeSeconds} s each after ${readWarmUpSeconds} s of each): board route ${lo.requests.average.toFixed(0)} req/s, p50 ${lo.latency.p50} ms, p99 ${lo.latency.p99} ms, non-2xx ${lo.non2xx}, errors ${lo.errors}; ` +
          `raw-statement route ${lw.requests.average.toFixed(0)} req/s, p50 ${lw.latency.p50} ms, p99 ${lw.latency.p99} ms, non-2xx ${lw.non2xx}, errors ${lw.errors}; ` +
          `raw / board throughput = ${(lw.requests.average / lo.requests.average).toFixed(2)}× (${load()})`,
      );
    } finally {
      harness.kill('SIGTERM');
    }

    // Where the API's time goes: an endpoint with no session, the cheapest signed-in endpoint (session and
    // user, no service), and the board's service call in this process (ORM and queries, no HTTP).
    const health = await time(100, () => fetch(`${base}/api/health`).then((x) => x.arrayBuffer()));
    const me = await time(100, () => dispatcher.request('GET', '/api/auth/me').then((x) => x.arrayBuffer()));
    Object.assign(process.env, {
      DB_NAME: benchDb,
      LOG_LEVEL: 'warn',
      NODE_ENV: 'production',
      SESSION_SECRET: 'stringfield-benchmark-session-secret-0123456789',
    });
    const { listWorkOrders } = await import('../../apps/api/src/services/work-orders.service.ts');
    const { workOrderListQuerySchema, pageQuerySchema } = await import('@stringfield/shared');
    const { sequelize } = await import('../../apps/api/src/models/index.ts');
    const boardQuery = workOrderListQuerySchema
      .and(pageQuerySchema)
      .parse(Object.fromEntries(new URL(base + board).searchParams));
    const dispatcherUser = {
      id: 0,
      email: 'dispatcher@stringfield.test',
      name: 'Bench',
      role: 'dispatcher' as const,
    };
    await time(10, () => listWorkOrders(dispatcherUser, boardQuery));
    const svc = await time(100, () =>
      listWorkOrders(dispatcherUser, boardQuery).then((p) => JSON.stringify(p)),
    );
    await sequelize.close();
    say(
      `  breakdown (medians): health, no session ${fmt(health.median)}; /api/auth/me, session + user ${fmt(me.median)}; ` +
        `board service in-process (ORM + 2 parallel queries + JSON) ${fmt(svc.median)}; service / raw = ${(svc.median / r.median).toFixed(2)}× (${load()})`,
    );

    const list = (await (
      await dispatcher.request('GET', '/api/work-orders?pageSize=1&status=in_field')
    ).json()) as { items: Array<{ id: number }> };
    const ticketId = list.items[0]!.id;
    const t = await time(40, () =>
      dispatcher.request('GET', `/api/work-orders/${ticketId}`).then((x) => x.arrayBuffer()),
    );
    say(`ticket page: median ${fmt(t.median)}, p95 ${fmt(t.p95)} (${load()})`);

    const today = new Date().toISOString().slice(0, 10);
    const from90 = new Date(Date.now() - 90 * 86_400_000).toISOString().slice(0, 10);
    const from365 = new Date(Date.now() - 365 * 86_400_000).toISOString().slice(0, 10);
    const m = await time(20, () =>
      dispatcher.request('GET', `/api/fleet/metrics?from=${from90}&to=${today}`).then((x) => x.arrayBuffer()),
    );
    say(
      `metrics, whole fleet, 90 days (100,000 tickets, 1,000,000 checks): median ${fmt(m.median)}, p95 ${fmt(m.p95)} (target median < 200 ms) (${load()})`,
    );
    const sites = (await (
      await dispatcher.request('GET', '/api/sites?q=Scale%20Field&pageSize=1')
    ).json()) as { items: Array<{ id: number; code: string }> };
    const site = sites.items[0]!;
    const ms = await time(20, () =>
      dispatcher
        .request('GET', `/api/fleet/metrics?siteId=${site.id}&from=${from365}&to=${today}`)
        .then((x) => x.arrayBuffer()),
    );
    say(`metrics, one site, 365 days: median ${fmt(ms.median)} (${load()})`);
    const h = await time(20, () =>
      dispatcher.request('GET', `/api/fleet/sites/${site.id}/health-map`).then((x) => x.arrayBuffer()),
    );
    say(`health map, 400 strings with 20,000 checks behind them: median ${fmt(h.median)} (${load()})`);

    // Export: stream a year of checks for one site and watch the server's memory.
    let peak = 0;
    const before = rssOfTree(server.pid!);
    const sampler = setInterval(() => (peak = Math.max(peak, rssOfTree(server.pid!))), 50);
    const t0 = performance.now();
    const res = await dispatcher.request(
      'GET',
      `/api/fleet/exports/checks.csv?siteId=${site.id}&from=${from365}&to=${today}`,
    );
    let bytes = 0;
    let lines = 0;
    for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
      bytes += chunk.length;
      for (const c of chunk) if (c === 10) lines += 1;
    }
    clearInterval(sampler);
    say(
      `checks CSV export, one site, 365 days: ${lines - 1} rows, ${(bytes / 1e6).toFixed(1)} MB in ${fmt(performance.now() - t0)}; server RSS ${(before / 1e6).toFixed(0)} MB before, peak ${(peak / 1e6).toFixed(0)} MB (${load()})`,
    );

    // Layout import: 5,000 rows into a fresh site of the scale fleet.
    const target = (await (await dispatcher.request('GET', '/api/sites?q=Z050&pageSize=1')).json()) as {
      items: Array<{ id: number }>;
    };
    const inverters = (await (
      await dispatcher.request('GET', `/api/inverters?siteId=${target.items[0]!.id}`)
    ).json()) as Array<{ tag: string }>;
    const rows = ['label,inverter,mppt_input,module_model,modules_in_series'];
    for (let i = 0; i < 5000; i += 1)
      rows.push(
        `IMP${Date.now().toString(36)}-${String(i).padStart(5, '0')},${inverters[i % inverters.length]!.tag},${1 + (i % 6)},SDM-405-72M,25`,
      );
    const csv = new Blob([rows.join('\n')], { type: 'text/csv' });
    for (const mode of ['dry-run', 'commit'] as const) {
      const form = new FormData();
      form.append('file', csv, 'layout.csv');
      const ti = performance.now();
      const ir = await dispatcher.request(
        'POST',
        `/api/sites/${target.items[0]!.id}/import?mode=${mode}`,
        form,
      );
      const body = (await ir.json()) as {
        validRows?: number;
        committed?: boolean;
        error?: { message: string };
      };
      say(
        `layout import, 5,000 rows, ${mode}: ${fmt(performance.now() - ti)} (status ${ir.status}, valid ${body.validRows ?? '?'}${body.error ? `, ${body.error.message}` : ''}) (target < 10 s) (${load()})`,
      );
    }

    // ---- under load: 32 connections, keep-alive, loopback ----
    say(
      `under load (autocannon, ${connections} connections, ${loadSeconds} s each, client and server on the same ${os.cpus().length} cores; ` +
        `the two reads after ${readWarmUpSeconds} s of the same load, not counted):`,
    );
    await loadRun(
      '  board, first page, two filters',
      { requests: [{ method: 'GET', path: board, headers: { cookie: dispatcher.cookie } }] },
      ' (targets: errors 0, p99 < 150 ms)',
      loadSeconds,
      readWarmUpSeconds,
    );
    await loadRun(
      '  ticket page',
      { requests: [{ method: 'GET', path: `/api/work-orders/${ticketId}`, headers: { cookie: dispatcher.cookie } }] },
      '',
      loadSeconds,
      readWarmUpSeconds,
    );

    // Check submission: the assigned technician records a string check; a new client id per request, so
    // that each one is a real insert (a repeated id would be answered from the first one, 200 not 201).
    const tech = new Client(base);
    await tech.signIn('tech@stringfield.test');
    const mine = (await (
      await tech.request('GET', '/api/work-orders?assigneeId=me&status=in_field&pageSize=1')
    ).json()) as { items: Array<{ id: number }> };
    const ticket = mine.items[0];
    if (!ticket) throw new Error('the bench data set has no in-field ticket for tech@stringfield.test');
    const detail = (await (await tech.request('GET', `/api/work-orders/${ticket.id}`)).json()) as {
      strings: Array<{ id: number }>;
    };
    const stringId = detail.strings[0]!.id;
    const checkPath = `/api/work-orders/${ticket.id}/checks`;
    const checkHeaders = {
      cookie: tech.cookie,
      'x-csrf-token': tech.csrf,
      'content-type': 'application/json',
    };
    const checkBody = () =>
      JSON.stringify({
        clientId: randomUUID(),
        stringId,
        phase: 'before',
        takenAt: new Date().toISOString(),
        vocV: 812.4,
        iscA: 10.2,
        polarityCorrect: true,
        notes: benchNote,
      });
    let created = 0;
    await loadRun('  check submission (POST, new check each time)', {
      requests: [
        {
          method: 'POST',
          path: checkPath,
          headers: checkHeaders,
          setupRequest: (req) => ({ ...req, body: checkBody() }),
          onResponse: (status) => {
            if (status === 201) created += 1;
          },
        },
      ],
    });
    const counted = await db.query<Array<{ n: number }>>('SELECT COUNT(*) AS n FROM string_checks WHERE notes = ?', [
      benchNote,
    ]);
    const inserted = counted[0]?.n ?? 0;
    say(
      `    ${created} answered 201; ${inserted} checks inserted (the few more were in flight when the run stopped)`,
    );
    await db.query('DELETE FROM string_checks WHERE notes = ?', [benchNote]);

    // Sign-in: each sign-in is a fresh session (GET /api/auth/csrf) and the POST; the POST's latency is
    // timed from the moment autocannon builds it to its response.
    let account = 0;
    const loginMs: number[] = [];
    const loginCodes = new Map<number, number>();
    type SignInContext = { cookie?: string; csrf?: string; email?: string; startedAt?: number };
    const signInRun = (accounts: number) => ({
      requests: [
        {
          method: 'GET' as const,
          path: '/api/auth/csrf',
          headers: {},
          onResponse: (
            _status: number,
            body: string,
            context: SignInContext,
            headers: Record<string, string | string[]>,
          ) => {
            context.cookie = setCookieOf(headers);
            context.csrf = (JSON.parse(body) as { csrfToken?: string }).csrfToken;
          },
        },
        {
          method: 'POST' as const,
          path: '/api/auth/login',
          setupRequest: (req: autocannon.Request, context: SignInContext) => {
            account += 1;
            context.startedAt = performance.now();
            const email = `bench-signin-${String((account % accounts) + 1).padStart(2, '0')}@stringfield.test`;
            return {
              ...req,
              headers: {
                cookie: context.cookie ?? '',
                'x-csrf-token': context.csrf ?? '',
                'content-type': 'application/json',
              },
              body: JSON.stringify({ email, password: 'stringfield-demo' }),
            };
          },
          onResponse: (status: number, _body: string, context: SignInContext) => {
            loginMs.push(performance.now() - (context.startedAt ?? performance.now()));
            loginCodes.set(status, (loginCodes.get(status) ?? 0) + 1);
          },
        },
      ],
    });
    await loadRun(
      `  sign-in (GET /api/auth/csrf + POST /api/auth/login, ${signInAccounts} accounts, default limit)`,
      signInRun(signInAccounts) as unknown as autocannon.Options,
    );
    const l = stats(loginMs);
    say(
      `    the POSTs alone: ${l.n} sign-ins, ${(l.n / loadSeconds).toFixed(1)}/s, p50 ${fmt(l.median)}, p99 ${fmt(l.p99)}; statuses ${[...loginCodes].map(([c, n]) => `${c}×${n}`).join(' ')} (${load()})`,
    );
    await db.query("DELETE FROM rate_limit_hits WHERE `key` LIKE 'login:%'");

    // The limiter's side of it: 32 sign-ins of one account from one address at once. Each attempt counts
    // while it runs, so the 11th concurrent one is refused (429) even though every password is right.
    loginMs.length = 0;
    loginCodes.clear();
    await loadRun(
      '  check: sign-in, one account, 32 at once, 5 s',
      signInRun(1) as unknown as autocannon.Options,
      '',
      5,
    );
    say(`    statuses of the POSTs: ${[...loginCodes].map(([c, n]) => `${c}×${n}`).join(' ')}`);
    await db.query("DELETE FROM rate_limit_hits WHERE `key` LIKE 'login:%'");

    fs.mkdirSync(path.join(root, '.data/reports'), { recursive: true });
    fs.writeFileSync(path.join(root, '.data/reports/bench-api.txt'), `${out.join('\n')}\n`);
  } finally {
    // autocannon drops its sockets when a run ends; let the sign-ins still running on the server finish
    // before it shuts down (and closes its database pool).
    await new Promise((r) => setTimeout(r, 3000));
    server.kill('SIGTERM');
    await db.end();
  }
}

await main();
