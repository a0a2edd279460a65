#!/usr/bin/env node
// npm start: everything from a fresh machine to a served product on http://127.0.0.1:8080.
// npm dependencies → MariaDB (installed, initialised, started) → migrations → demo data → mail catcher →
// web build → one Express process serving web and API.
import { spawn } from 'node:child_process';
import path from 'node:path';
import {
  ensureNodeModules,
  ensureWebBuild,
  isPortOpen,
  log,
  root,
  run,
  sessionSecret,
  tsxBin,
} from './lib.mjs';

const port = Number(process.env.PORT ?? 8080);
const mailPort = Number(process.env.MAIL_PORT ?? 1025);

ensureNodeModules();
run(process.execPath, [path.join(root, 'scripts/db.mjs'), 'start', '--databases', process.env.DB_NAME ?? 'stringfield']);
const env = { SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(), NODE_ENV: 'production' };
run(tsxBin, ['apps/api/src/cli/migrate.ts', 'up'], { env });
if (process.env.DEMO_SEED !== 'false') run(tsxBin, ['apps/api/src/cli/seed.ts'], { env });
ensureWebBuild();

const children = [];
if (await isPortOpen(mailPort)) {
  log(`Something already listens on 127.0.0.1:${mailPort}; using it as the mail server.`);
} else {
  children.push(spawn(tsxBin, ['scripts/mail-catcher.ts'], { cwd: root, stdio: 'inherit', env: { ...process.env, MAIL_PORT: String(mailPort) } }));
}
if (await isPortOpen(port)) {
  log(`Port ${port} is already in use. Stop the other program or run PORT=8081 npm start.`);
  children.forEach((c) => c.kill('SIGTERM'));
  process.exit(1);
}
// glibc's malloc keeps one arena per thread; libvips' worker threads (photo uploads) then leave a
// large, mostly empty heap behind. Two arenas: same photo time, a third less peak memory
// (npm run bench:photo measures both).
const api = spawn(tsxBin, ['apps/api/src/server.ts'], {
  cwd: root,
  stdio: 'inherit',
  env: {
    MALLOC_ARENA_MAX: '2',
    ...process.env,
    ...env,
    PORT: String(port),
    SMTP_URL: process.env.SMTP_URL ?? `smtp://127.0.0.1:${mailPort}`,
  },
});
children.push(api);

const deadline = Date.now() + 60_000;
while (!(await isPortOpen(port))) {
  if (api.exitCode !== null || Date.now() > deadline) {
    log('The API did not start; see the messages above.');
    children.forEach((c) => c.kill('SIGTERM'));
    process.exit(1);
  }
  await new Promise((r) => setTimeout(r, 300));
}

log('');
log(`Stringfield is ready: http://127.0.0.1:${port}`);
log('Demo sign-ins (password for all: stringfield-demo):');
for (const [role, email] of [
  ['admin', 'admin@stringfield.test'],
  ['dispatcher', 'dispatcher@stringfield.test'],
  ['technician', 'tech@stringfield.test'],
  ['supervisor', 'supervisor@stringfield.test'],
  ['owner', 'owner@stringfield.test'],
]) {
  log(`  ${role.padEnd(11)} ${email}`);
}
log(`Captured e-mail: sign in as admin → Outbox (files under .data/mail). Stop with Ctrl+C; MariaDB keeps running (npm run db:stop).`);

const stop = () => {
  children.forEach((c) => c.kill('SIGTERM'));
  setTimeout(() => process.exit(0), 500);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
api.on('exit', (code) => {
  children.forEach((c) => c.kill('SIGTERM'));
  process.exit(code ?? 0);
});
