#!/usr/bin/env node
// npm run dev: MariaDB, migrations, demo data, mail catcher, the API under `tsx watch` and Vite's dev
// server (http://127.0.0.1:5173, /api proxied to the API on 8080).
import { spawn } from 'node:child_process';
import path from 'node:path';
import { ensureNodeModules, isPortOpen, log, root, run, sessionSecret, tsxBin } from './lib.mjs';

ensureNodeModules();
run(process.execPath, [path.join(root, 'scripts/db.mjs'), 'start']);
const env = { ...process.env, SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret() };
run(tsxBin, ['apps/api/src/cli/migrate.ts', 'up'], { env });
run(tsxBin, ['apps/api/src/cli/seed.ts'], { env });

const children = [];
if (!(await isPortOpen(Number(process.env.MAIL_PORT ?? 1025)))) {
  children.push(spawn(tsxBin, ['scripts/mail-catcher.ts'], { cwd: root, stdio: 'inherit', env }));
}
children.push(spawn(tsxBin, ['watch', 'apps/api/src/server.ts'], { cwd: root, stdio: 'inherit', env }));
children.push(spawn('npm', ['run', 'dev', '-w', 'apps/web'], { cwd: root, stdio: 'inherit', env }));
log('Dev servers starting: web http://127.0.0.1:5173 (API on :8080).');

const stop = () => {
  children.forEach((c) => c.kill('SIGTERM'));
  setTimeout(() => process.exit(0), 500);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
