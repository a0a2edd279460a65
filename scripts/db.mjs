#!/usr/bin/env node
// The project's own MariaDB: installed from Debian's packages when missing, data under .data/mariadb,
// listening on 127.0.0.1:DB_PORT (default 3307) with its own socket and pid file. It never touches a
// system MariaDB that may already run on 3306.
//   node scripts/db.mjs start [--databases a,b]   idempotent: install, initialise, start, wait, create db + user
//   node scripts/db.mjs stop
//   node scripts/db.mjs status
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { aptInstall, dataDir, fail, isPortOpen, isRoot, log, which } from './lib.mjs';

const port = Number(process.env.DB_PORT ?? 3307);
const appUser = process.env.DB_USER ?? 'stringfield';
const appPassword = process.env.DB_PASSWORD ?? 'stringfield-local';
const datadir = path.join(dataDir, 'mariadb');
const rundir = path.join(dataDir, 'run');
const socket = path.join(rundir, 'mariadb.sock');
const pidFile = path.join(rundir, 'mariadb.pid');
const logFile = path.join(dataDir, 'mariadb.log');

function client(args, input) {
  return spawnSync(which('mariadb') ?? 'mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', ...args], {
    encoding: 'utf8',
    input,
  });
}

function ourPid() {
  try {
    const pid = Number(fs.readFileSync(pidFile, 'utf8').trim());
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

function answers() {
  return client(['-e', 'SELECT 1']).status === 0;
}

function ensureInstalled() {
  if (which('mariadbd') && which('mariadb-install-db') && which('mariadb')) return;
  aptInstall(['mariadb-server', 'mariadb-client'], 'MariaDB (mariadbd)');
  if (!which('mariadbd')) fail('MariaDB was installed but mariadbd is still not on the PATH.');
}

function ensureInitialised() {
  if (fs.existsSync(path.join(datadir, 'mysql'))) return;
  log(`Initialising a MariaDB data directory in ${path.relative(process.cwd(), datadir) || datadir}…`);
  fs.mkdirSync(datadir, { recursive: true });
  const user = isRoot ? 'root' : (process.env.USER ?? 'nobody');
  const r = spawnSync(
    which('mariadb-install-db'),
    [
      '--no-defaults',
      `--user=${user}`,
      `--datadir=${datadir}`,
      '--auth-root-authentication-method=normal',
      '--skip-test-db',
    ],
    { encoding: 'utf8' },
  );
  if (r.status !== 0) {
    fs.rmSync(datadir, { recursive: true, force: true });
    fail(`mariadb-install-db failed:\n${r.stdout}\n${r.stderr}`);
  }
}

async function start(databases) {
  ensureInstalled();
  ensureInitialised();
  fs.mkdirSync(rundir, { recursive: true });
  if (!(ourPid() && answers())) {
    if (await isPortOpen(port)) {
      fail(
        `Port ${port} is taken by another program, not Stringfield's MariaDB. Stop it or choose another port with DB_PORT=…`,
      );
    }
    log(`Starting MariaDB on 127.0.0.1:${port}…`);
    const args = [
      '--no-defaults',
      `--datadir=${datadir}`,
      `--socket=${socket}`,
      `--port=${port}`,
      '--bind-address=127.0.0.1',
      `--pid-file=${pidFile}`,
      `--log-error=${logFile}`,
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--innodb-buffer-pool-size=512M',
      '--max-connections=300',
      '--skip-name-resolve',
    ];
    if (isRoot) args.splice(1, 0, '--user=root');
    const child = spawn(which('mariadbd'), args, { detached: true, stdio: 'ignore' });
    child.unref();
    const deadline = Date.now() + 60_000;
    while (!answers()) {
      if (Date.now() > deadline) fail(`MariaDB did not answer within 60 s; see ${logFile}`);
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  const q = (s) => s.replace(/'/g, "''");
  const sql = [
    ...databases.map((d) => `CREATE DATABASE IF NOT EXISTS \`${d}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`),
    `CREATE USER IF NOT EXISTS '${q(appUser)}'@'127.0.0.1' IDENTIFIED BY '${q(appPassword)}';`,
    `CREATE USER IF NOT EXISTS '${q(appUser)}'@'localhost' IDENTIFIED BY '${q(appPassword)}';`,
    `ALTER USER '${q(appUser)}'@'127.0.0.1' IDENTIFIED BY '${q(appPassword)}';`,
    `ALTER USER '${q(appUser)}'@'localhost' IDENTIFIED BY '${q(appPassword)}';`,
    // The test suites create and drop their own databases (stringfield_test, stringfield_e2e…).
    `GRANT ALL PRIVILEGES ON \`stringfield%\`.* TO '${q(appUser)}'@'127.0.0.1';`,
    `GRANT ALL PRIVILEGES ON \`stringfield%\`.* TO '${q(appUser)}'@'localhost';`,
    ...databases.map((d) => `GRANT ALL PRIVILEGES ON \`${d}\`.* TO '${q(appUser)}'@'127.0.0.1';`),
    'FLUSH PRIVILEGES;',
  ].join('\n');
  const r = client([], sql);
  if (r.status !== 0) fail(`Could not create the database or its user:\n${r.stderr}`);
  log(`MariaDB is up on 127.0.0.1:${port} (databases: ${databases.join(', ')}).`);
}

async function stop() {
  const pid = ourPid();
  if (!pid) {
    log('MariaDB (ours) is not running.');
    return;
  }
  const admin = which('mariadb-admin');
  if (admin) spawnSync(admin, ['--no-defaults', `--socket=${socket}`, '-uroot', 'shutdown'], { stdio: 'ignore' });
  else process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + 30_000;
  while (ourPid()) {
    if (Date.now() > deadline) {
      process.kill(pid, 'SIGKILL');
      break;
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  log('MariaDB stopped.');
}

const [cmd = 'start', ...rest] = process.argv.slice(2);
const dbFlag = rest.indexOf('--databases');
const databases =
  dbFlag >= 0 && rest[dbFlag + 1] ? rest[dbFlag + 1].split(',') : [process.env.DB_NAME ?? 'stringfield'];

if (cmd === 'start') await start(databases);
else if (cmd === 'stop') await stop();
else if (cmd === 'status') {
  const up = Boolean(ourPid()) && answers();
  log(up ? `MariaDB (ours) is running on 127.0.0.1:${port}.` : 'MariaDB (ours) is not running.');
  process.exit(up ? 0 : 1);
} else fail(`Unknown command "${cmd}". Use start, stop or status.`);
