// Helpers shared by the project's scripts. Plain Node built-ins only: these run before `npm ci`.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const dataDir = path.join(root, '.data');

export function log(msg) {
  process.stdout.write(`\x1b[36m[stringfield]\x1b[0m ${msg}\n`);
}

export function fail(msg) {
  process.stderr.write(`\x1b[31m[stringfield] ${msg}\x1b[0m\n`);
  process.exit(1);
}

/** Run a command, inheriting stdio; throws when it exits non-zero. */
export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts, env: { ...process.env, ...opts.env } });
  if (r.error) throw r.error;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${r.status}`);
}

/** Run a command and resolve with its exit code (never throws on non-zero). */
export function runAsync(cmd, args, opts = {}) {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', cwd: root, ...opts, env: { ...process.env, ...opts.env } });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(127));
  });
}

export function which(cmd) {
  const r = spawnSync('sh', ['-c', `command -v ${cmd}`], { encoding: 'utf8' });
  if (r.status === 0 && r.stdout.trim()) return r.stdout.trim();
  for (const dir of ['/usr/sbin', '/usr/bin', '/sbin', '/usr/local/bin']) {
    const p = path.join(dir, cmd);
    if (fs.existsSync(p)) return p;
  }
  return null;
}

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

let aptUpdated = false;
/** Install Debian packages when running as root; otherwise stop and say what to install. */
export function aptInstall(packages, why) {
  if (!isRoot) {
    fail(`${why} is missing. Install it with: sudo apt-get install -y ${packages.join(' ')}  (then run the command again)`);
  }
  log(`${why} is missing: installing ${packages.join(' ')} from Debian's packages…`);
  const env = { DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    run('apt-get', ['update', '-qq'], { env });
    aptUpdated = true;
  }
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], { env });
}

function newestMtime(p) {
  try {
    return fs.statSync(p).mtimeMs;
  } catch {
    return 0;
  }
}

/** `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureNodeModules() {
  const marker = path.join(root, 'node_modules/.package-lock.json');
  const lock = path.join(root, 'package-lock.json');
  if (fs.existsSync(marker) && newestMtime(marker) >= newestMtime(lock)) return;
  log('Installing npm dependencies (npm ci)…');
  run('npm', ['ci', '--no-audit', '--no-fund'], { env: { PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' } });
}

/** A random secret kept under .data/, so several API processes on this machine share sessions. */
export function sessionSecret() {
  const file = path.join(dataDir, 'session-secret');
  if (!fs.existsSync(file)) {
    fs.mkdirSync(dataDir, { recursive: true });
    const bytes = new Uint8Array(32);
    globalThis.crypto.getRandomValues(bytes);
    fs.writeFileSync(file, Buffer.from(bytes).toString('hex'), { mode: 0o600 });
  }
  return fs.readFileSync(file, 'utf8').trim();
}

/** Newest modification time of any file below the given folders (skipping node_modules and dist). */
export function newestSourceMtime(dirs) {
  let newest = 0;
  const walk = (d) => {
    let entries;
    try {
      entries = fs.readdirSync(d, { withFileTypes: true });
    } catch {
      return;
    }
    for (const e of entries) {
      if (e.name === 'node_modules' || e.name === 'dist') continue;
      const p = path.join(d, e.name);
      if (e.isDirectory()) walk(p);
      else newest = Math.max(newest, newestMtime(p));
    }
  };
  dirs.forEach((d) => walk(path.join(root, d)));
  return newest;
}

/** Build the web app unless its dist is newer than every source it depends on. */
export function ensureWebBuild({ force = false } = {}) {
  const built = newestMtime(path.join(root, 'apps/web/dist/index.html'));
  const sources = newestSourceMtime(['apps/web', 'packages/shared/src', 'packages/pv/src']);
  if (!force && built > sources) return;
  log('Building the web app…');
  run('npm', ['run', 'build', '-w', 'apps/web']);
}

/** Whether something accepts TCP connections on host:port. */
export async function isPortOpen(port, host = '127.0.0.1') {
  const net = await import('node:net');
  return new Promise((resolve) => {
    const s = net.createConnection({ port, host });
    s.once('connect', () => {
      s.destroy();
      resolve(true);
    });
    s.once('error', () => resolve(false));
    s.setTimeout(1000, () => {
      s.destroy();
      resolve(false);
    });
  });
}

export const tsxBin = path.join(root, 'node_modules/.bin/tsx');
