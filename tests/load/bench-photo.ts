// Photo pipeline benchmark (issue #7): a 12-megapixel JPEG checked, re-encoded and sized (screen + thumbnail)
// in a fresh child process, so its RSS is the pipeline's own; then 10 concurrent uploads through the real HTTP
// route of an API started against its own database (BENCH_PHOTO_DB, default stringfield_bench_photo, dropped
// and re-created with the demo seed). Loopback only. Targets: median < 400 ms, peak RSS < 300 MB, 10/10 uploads.
// Figures go to .data/reports/bench-photo.txt.
import { spawn, execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Client, root, rssOfTree, startApi, stats, tsx } from './lib.ts';

const runs = 10;

type PipelineResult = {
  baselineMb: number;
  peakMb: number;
  medianMs: number;
  p95Ms: number;
  runs: number;
  bytes: number;
  sharp: string;
};

/** VmRSS / VmHWM of this process from /proc, in MB (10^6 bytes). */
function procMb(field: 'VmRSS' | 'VmHWM', pid: number | 'self' = 'self'): number {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  return (Number(new RegExp(`${field}:\\s+(\\d+)`).exec(status)?.[1] ?? 0) * 1024) / 1e6;
}

const rssOfTreeMb = (pid: number) => rssOfTree(pid) / 1e6;

/** Child mode: only the service module and the photo are loaded before the baseline is taken. */
async function childPipeline(file: string): Promise<void> {
  const { processImage } = await import('../../apps/api/src/services/evidence.service.ts');
  const sharp = (await import('sharp')).default;
  const photo = fs.readFileSync(file);
  const baselineMb = procMb('VmRSS');
  const run = () =>
    processImage(
      { originalname: 'bench.jpg', buffer: photo, mimetype: 'image/jpeg' },
      { tag: 'other', stringId: null, modulePosition: null, caption: '' },
      0,
    );
  await run();
  const ms: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const t = performance.now();
    await run();
    ms.push(performance.now() - t);
  }
  const s = stats(ms);
  const result: PipelineResult = {
    baselineMb,
    // VmHWM is the kernel's high-water mark of resident memory: exact, no sampling gaps.
    peakMb: procMb('VmHWM'),
    medianMs: s.median,
    p95Ms: s.p95,
    runs,
    bytes: photo.length,
    sharp: `sharp ${sharp.versions.sharp}, libvips ${sharp.versions.vips}, concurrency ${sharp.concurrency()}, cache ${JSON.stringify(sharp.cache())}`,
  };
  process.stdout.write(`RESULT ${JSON.stringify(result)}\n`);
}

function runChild(file: string, extraEnv: Record<string, string> = {}): Promise<PipelineResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(tsx, [fileURLToPath(import.meta.url), '--pipeline', file], {
      cwd: root,
      env: { ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'warn', ...extraEnv },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.on('error', reject);
    child.on('exit', (code) => {
      const line = out.split('\n').find((l) => l.startsWith('RESULT '));
      if (code !== 0 || !line) reject(new Error(`pipeline child exited ${code}: ${out}`));
      else resolve(JSON.parse(line.slice(7)) as PipelineResult);
    });
  });
}

async function concurrentUploads(photo: Buffer, say: (line: string) => void): Promise<void> {
  const port = Number(process.env.BENCH_PHOTO_PORT ?? 8097);
  const base = `http://127.0.0.1:${port}`;
  const dbName = process.env.BENCH_PHOTO_DB ?? 'stringfield_bench_photo';
  const dbPort = Number(process.env.DB_PORT ?? 3307);
  const uploads = path.join(root, '.data/uploads-bench-photo');
  const { Sequelize } = await import('sequelize');
  const admin = new Sequelize(
    '',
    process.env.DB_USER ?? 'stringfield',
    process.env.DB_PASSWORD ?? 'stringfield-local',
    { dialect: 'mariadb', host: '127.0.0.1', port: dbPort, logging: false },
  );
  await admin.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
  await admin.query(`CREATE DATABASE \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();
  fs.rmSync(uploads, { recursive: true, force: true });
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    SESSION_SECRET: 'stringfield-benchmark-session-secret-0123456789',
    DB_NAME: dbName,
    PORT: String(port),
    LOG_LEVEL: 'warn',
    SMTP_URL: 'smtp://127.0.0.1:1',
    UPLOADS_DIR: uploads,
    LOGIN_RATE_LIMIT: '1000',
  };
  execFileSync(tsx, ['apps/api/src/cli/migrate.ts', 'up'], {
    cwd: root,
    env,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  execFileSync(tsx, ['apps/api/src/cli/seed.ts'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });

  const server = await startApi(port, { DB_NAME: dbName, UPLOADS_DIR: uploads, LOGIN_RATE_LIMIT: '1000' });
  try {
    const tech = new Client(base);
    await tech.signIn('tech@stringfield.test');
    const mine = (await (
      await tech.request('GET', '/api/work-orders?assigneeId=me&status=in_field&pageSize=1')
    ).json()) as { items: Array<{ id: number; number: string }> };
    const ticket = mine.items[0];
    if (!ticket) throw new Error('the demo seed has no in-field ticket for tech@stringfield.test');
    const blob = new Blob([new Uint8Array(photo)], { type: 'image/jpeg' });
    const form = () => {
      const f = new FormData();
      f.append('meta', JSON.stringify([{ tag: 'other' }]));
      f.append('files', blob, 'bench.jpg');
      return f;
    };
    const one = await tech.request('POST', `/api/work-orders/${ticket.id}/photos`, form());
    if (one.status !== 201) throw new Error(`warm-up upload answered ${one.status}: ${await one.text()}`);
    const before = rssOfTreeMb(server.pid!);
    let peak = before;
    const sampler = setInterval(() => (peak = Math.max(peak, rssOfTreeMb(server.pid!))), 20);
    const t0 = performance.now();
    const results = await Promise.all(
      Array.from({ length: 10 }, async () => {
        const t = performance.now();
        const res = await tech.request('POST', `/api/work-orders/${ticket.id}/photos`, form());
        const text = await res.text();
        return { status: res.status, ms: performance.now() - t, text };
      }),
    );
    const wall = performance.now() - t0;
    clearInterval(sampler);
    const ok = results.filter((r) => r.status === 201).length;
    const s = stats(results.map((r) => r.ms));
    say(
      `10 concurrent 12-MP uploads through POST /api/work-orders/:id/photos (local disk): ${ok}/10 answered 201 in ${wall.toFixed(0)} ms (per request median ${s.median.toFixed(0)} ms, slowest ${Math.max(...results.map((r) => r.ms)).toFixed(0)} ms); server RSS ${before.toFixed(0)} MB after one warm-up upload, peak ${peak.toFixed(0)} MB (sampled every 20 ms)`,
    );
    for (const r of results.filter((x) => x.status !== 201))
      say(`  refused: ${r.status} ${r.text.slice(0, 200)}`);
  } finally {
    server.kill('SIGTERM');
  }
}

async function main() {
  const out: string[] = [];
  const say = (line: string) => {
    out.push(line);
    process.stdout.write(`${line}\n`);
  };
  const sharp = (await import('sharp')).default;
  // The same fixture as bench-api: grey with Gaussian noise, so the JPEG is as hard to code as a real photo.
  const photo = await sharp({
    create: {
      width: 4000,
      height: 3000,
      channels: 3,
      background: '#808080',
      noise: { type: 'gaussian', mean: 128, sigma: 20 },
    },
  })
    .jpeg({ quality: 90 })
    .toBuffer();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-bench-photo-'));
  const file = path.join(dir, 'photo-12mp.jpg');
  fs.writeFileSync(file, photo);
  const load = os
    .loadavg()
    .map((x) => x.toFixed(2))
    .join(' ');
  say(
    `Stringfield photo benchmark — ${new Date().toISOString()} — ${process.platform} ${process.arch}, Node ${process.version}, ${os.cpus().length} cores, load ${load}`,
  );
  try {
    const r = await runChild(file);
    say(r.sharp);
    say(
      `12-megapixel JPEG (${(r.bytes / 1e6).toFixed(1)} MB) through the photo pipeline (checks, EXIF, re-encode, screen + thumbnail), fresh process, ${r.runs} runs after one warm-up: median ${r.medianMs.toFixed(1)} ms, p95 ${r.p95Ms.toFixed(1)} ms (target < 400 ms)`,
    );
    say(
      `  RSS: baseline ${r.baselineMb.toFixed(0)} MB (modules loaded, photo read), peak ${r.peakMb.toFixed(0)} MB (VmHWM), pipeline's own ${(r.peakMb - r.baselineMb).toFixed(0)} MB (target peak < 300 MB)`,
    );
    // glibc gives each libvips worker thread its own malloc arena; capping them shows how much of the peak is
    // allocator fragmentation rather than pixels. npm start runs the API this way (and so does the upload
    // run below, through tests/load/lib.ts).
    const capped = await runChild(file, { MALLOC_ARENA_MAX: '2' });
    say(
      `  same with MALLOC_ARENA_MAX=2: median ${capped.medianMs.toFixed(1)} ms; RSS baseline ${capped.baselineMb.toFixed(0)} MB, peak ${capped.peakMb.toFixed(0)} MB, pipeline's own ${(capped.peakMb - capped.baselineMb).toFixed(0)} MB`,
    );
    if (!process.argv.includes('--pipeline-only')) await concurrentUploads(photo, say);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
  fs.mkdirSync(path.join(root, '.data/reports'), { recursive: true });
  fs.writeFileSync(path.join(root, '.data/reports/bench-photo.txt'), `${out.join('\n')}\n`);
}

const at = process.argv.indexOf('--pipeline');
if (at !== -1) await childPipeline(process.argv[at + 1]!);
else await main();
