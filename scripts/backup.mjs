#!/usr/bin/env node
// npm run db:backup [-- --to DIR]   : mariadb-dump of DB_NAME (one consistent snapshot) + the uploads folder
// npm run db:restore -- --from DIR [--into NAME] : load a backup into DB_NAME (or NAME), replacing it, and
//                                     put the uploads back beside it (only when restoring into DB_NAME)
// Uses the project's own MariaDB (scripts/db.mjs) through its socket as root.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { dataDir, fail, log, which } from './lib.mjs';

const socket = path.join(dataDir, 'run/mariadb.sock');
const dbName = process.env.DB_NAME ?? 'stringfield';
const uploads = process.env.UPLOADS_DIR ?? path.join(dataDir, 'uploads');
const arg = (name) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
};
const safeName = (n) => {
  if (!/^[a-z0-9_]+$/.test(n)) fail(`Database name "${n}": lower-case letters, digits and _ only.`);
  return n;
};

function backup() {
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const dir = path.resolve(arg('--to') ?? path.join(dataDir, 'backups', stamp));
  fs.mkdirSync(dir, { recursive: true });
  const dump = which('mariadb-dump') ?? fail('mariadb-dump is missing (Debian package mariadb-client).');
  const out = fs.openSync(path.join(dir, 'database.sql'), 'w');
  const r = spawnSync(dump, ['--no-defaults', `--socket=${socket}`, '-uroot', '--single-transaction', '--routines', '--triggers', '--hex-blob', safeName(dbName)], { stdio: ['ignore', out, 'pipe'] });
  fs.closeSync(out);
  if (r.status !== 0) fail(`mariadb-dump failed: ${r.stderr}`);
  if (fs.existsSync(uploads)) fs.cpSync(uploads, path.join(dir, 'uploads'), { recursive: true });
  fs.writeFileSync(path.join(dir, 'manifest.json'), JSON.stringify({ database: dbName, createdAt: new Date().toISOString(), uploads: fs.existsSync(uploads) }, null, 2));
  log(`Backup of ${dbName} written to ${dir}`);
  process.stdout.write(`${dir}\n`);
}

function restore() {
  const dir = path.resolve(arg('--from') ?? fail('Say which backup: npm run db:restore -- --from .data/backups/<folder>'));
  const sqlFile = path.join(dir, 'database.sql');
  if (!fs.existsSync(sqlFile)) fail(`${sqlFile} does not exist.`);
  const target = safeName(arg('--into') ?? dbName);
  const client = which('mariadb') ?? fail('The mariadb client is missing (Debian package mariadb-client).');
  const base = ['--no-defaults', `--socket=${socket}`, '-uroot'];
  const reset = spawnSync(client, [...base, '-e', `DROP DATABASE IF EXISTS \`${target}\`; CREATE DATABASE \`${target}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`], { encoding: 'utf8' });
  if (reset.status !== 0) fail(`Could not recreate ${target}: ${reset.stderr}`);
  const input = fs.openSync(sqlFile, 'r');
  const r = spawnSync(client, [...base, target], { stdio: [input, 'inherit', 'pipe'] });
  fs.closeSync(input);
  if (r.status !== 0) fail(`Loading the backup failed: ${r.stderr}`);
  if (target === dbName && fs.existsSync(path.join(dir, 'uploads'))) {
    fs.rmSync(uploads, { recursive: true, force: true });
    fs.cpSync(path.join(dir, 'uploads'), uploads, { recursive: true });
  }
  log(`Restored ${dir} into ${target}.`);
}

const cmd = process.argv[2];
if (cmd === 'backup') backup();
else if (cmd === 'restore') restore();
else fail('Use: node scripts/backup.mjs backup|restore');
