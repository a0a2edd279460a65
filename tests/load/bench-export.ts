// npm run bench:export — a checks CSV export of 1,000,000 rows for one site, read by a client on
// loopback, with the API server's memory (RSS of its process tree) sampled while the rows flow.
// Builds its own database (stringfield_export_bench: one site, 400 strings, 1,000,000 checks) with the
// scale seeder when it is missing. Figures go to .data/reports/bench-export.txt.
import fs from 'node:fs';
import path from 'node:path';
import mariadb from 'mariadb';
import { Client, root, rssOfTree, startApi } from './lib.ts';

const dbName = 'stringfield_export_bench';
const rowsWanted = 1_000_000;
const port = Number(process.env.BENCH_PORT ?? 8096);
const base = `http://127.0.0.1:${port}`;
const dbPort = Number(process.env.DB_PORT ?? 3307);
const out: string[] = [];
const say = (line: string) => {
  out.push(line);
  process.stdout.write(`${line}\n`);
};
const mb = (bytes: number) => `${(bytes / 1e6).toFixed(0)} MB`;

async function checksInDb(): Promise<number> {
  const conn = await mariadb
    .createConnection({
      host: '127.0.0.1',
      port: dbPort,
      user: 'stringfield',
      password: process.env.DB_PASSWORD ?? 'stringfield-local',
      database: dbName,
    })
    .catch(() => null);
  if (!conn) return 0;
  try {
    const rows = (await conn
      .query('SELECT COUNT(*) AS n FROM string_checks')
      .catch(() => [{ n: 0 }])) as Array<{ n: bigint | number }>;
    return Number(rows[0]?.n ?? 0);
  } finally {
    await conn.end();
  }
}

async function main() {
  if ((await checksInDb()) < rowsWanted) {
    // One site carries every check, so a single site-and-period export has a million rows.
    Object.assign(process.env, {
      DB_NAME: dbName,
      SCALE_SITES: '1',
      SCALE_WORK_ORDERS: '5000',
      SCALE_CHECKS: String(rowsWanted),
    });
    const { seedScale } = await import('./seed-scale.ts');
    await seedScale();
  }
  const conn = await mariadb.createConnection({
    host: '127.0.0.1',
    port: dbPort,
    user: 'stringfield',
    password: process.env.DB_PASSWORD ?? 'stringfield-local',
    database: dbName,
  });
  const [site] = await conn.query<Array<{ id: number; code: string }>>(
    "SELECT id, code FROM sites WHERE code LIKE 'Z%' ORDER BY id LIMIT 1",
  );
  const [inSite] = await conn.query<Array<{ n: bigint }>>(
    'SELECT COUNT(*) AS n FROM string_checks c JOIN work_orders w ON w.id = c.work_order_id WHERE w.site_id = ?',
    [site!.id],
  );
  await conn.end();

  const server = await startApi(port, { DB_NAME: dbName, UPLOADS_DIR: path.join(root, '.data/uploads-bench') });
  try {
    const os = await import('node:os');
    say(
      `Stringfield export benchmark — ${new Date().toISOString()} — ${process.platform} ${process.arch}, Node ${process.version}, ${os.cpus().length} cores, load average ${os
        .loadavg()
        .map((x) => x.toFixed(2))
        .join(' ')}`,
    );

    const dispatcher = new Client(base);
    await dispatcher.signIn('dispatcher@stringfield.test');
    const cookie = dispatcher.cookie;

    const to = new Date().toISOString().slice(0, 10);
    const from = new Date(Date.now() - 500 * 86_400_000).toISOString().slice(0, 10);
    const before = rssOfTree(server.pid!);
    let peak = before;
    let lines = 0;
    let bytes = 0;
    const marks: string[] = [];
    const t0 = performance.now();
    const sampler = setInterval(() => (peak = Math.max(peak, rssOfTree(server.pid!))), 100);
    const res = await fetch(`${base}/api/fleet/exports/checks.csv?siteId=${site!.id}&from=${from}&to=${to}`, {
      headers: { cookie },
    });
    if (res.status !== 200) throw new Error(`export answered ${res.status}`);
    let nextMark = 100_000;
    for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
      bytes += chunk.length;
      for (const b of chunk) if (b === 10) lines += 1;
      if (lines >= nextMark) {
        marks.push(`${(nextMark / 1000).toFixed(0)}k rows ${mb(rssOfTree(server.pid!))}`);
        nextMark += 100_000;
      }
    }
    clearInterval(sampler);
    const seconds = (performance.now() - t0) / 1000;
    const rows = lines - 1;
    say(
      `checks CSV export, one site, ${from} to ${to}: ${rows.toLocaleString('en')} rows (${Number(inSite!.n).toLocaleString('en')} checks in the site), ${(bytes / 1e6).toFixed(0)} MB in ${seconds.toFixed(1)} s (${Math.round(rows / seconds).toLocaleString('en')} rows/s)`,
    );
    say(
      `  server RSS (process tree): ${mb(before)} before, peak ${mb(peak)} (+${mb(peak - before)}); while streaming: ${marks.join(', ')}`,
    );
  } finally {
    server.kill('SIGTERM');
  }
  fs.mkdirSync(path.join(root, '.data/reports'), { recursive: true });
  fs.writeFileSync(path.join(root, '.data/reports/bench-export.txt'), `${out.join('\n')}\n`);
}

await main();
