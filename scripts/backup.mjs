#!/usr/bin/env node
// npm run db:backup [-- --to DIR]   : mariadb-dump of DB_NAME (one consistent snapshot) + the uploads folder
//                                     (or, with S3_* set, every object of the bucket), with a manifest of
//                                     SHA-256 digests of every file
// npm run db:restore -- --from DIR [--into NAME] : load a backup into DB_NAME (or NAME), replacing it, and
//                                     put the uploads back beside it (only when restoring into DB_NAME)
// A restore checks the backup against its manifest and loads it into a staging database first; only a
// complete load replaces the live database (one atomic RENAME TABLE) and the uploads folder. A backup that
// is damaged or fails to load leaves the database and the uploads as they were.
// Uses the project's own MariaDB (scripts/db.mjs) through its socket as root.
import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { dataDir, fail, log, root, tsxBin, which } from './lib.mjs';

const socket = path.join(dataDir, 'run/mariadb.sock');
const dbName = process.env.DB_NAME ?? 'stringfield';
const uploads = process.env.UPLOADS_DIR ?? path.join(dataDir, 'uploads');
const arg = (name) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
};
// Uploads in an S3-compatible bucket: the bucket is copied object by object (apps/api/src/cli/bucket-copy.ts).
const inBucket = Boolean(process.env.S3_BUCKET);
const bucketCopy = (cmd, dir) => {
  const r = spawnSync(tsxBin, ['apps/api/src/cli/bucket-copy.ts', cmd, path.join(dir, 'objects'), path.join(dir, 'objects.json')], {
    cwd: root,
    encoding: 'utf8',
  });
  return r.status === 0 ? { count: Number(r.stdout.trim()) } : { error: (r.stderr || r.stdout).trim().split('\n').at(-1) };
};
const safeName = (n) => {
  if (!/^[a-z0-9_]+$/.test(n)) fail(`Database name "${n}": lower-case letters, digits and _ only.`);
  return n;
};

function sha256(file) {
  const hash = crypto.createHash('sha256');
  const fd = fs.openSync(file, 'r');
  const buf = Buffer.alloc(1 << 20);
  for (let n; (n = fs.readSync(fd, buf, 0, buf.length, null)) > 0; ) hash.update(buf.subarray(0, n));
  fs.closeSync(fd);
  return hash.digest('hex');
}

/** Every file under `dir`, as paths relative to it, in a stable order. */
function filesUnder(dir) {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath ?? e.path, e.name)))
    .sort();
}

/** The files of a backup besides database.sql and the manifest: uploads, or bucket objects and their index. */
function contentsOf(dir) {
  return [
    ...filesUnder(path.join(dir, 'uploads')).map((f) => path.join('uploads', f)),
    ...filesUnder(path.join(dir, 'objects')).map((f) => path.join('objects', f)),
    ...(fs.existsSync(path.join(dir, 'objects.json')) ? ['objects.json'] : []),
  ];
}

function backup() {
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const dir = path.resolve(arg('--to') ?? path.join(dataDir, 'backups', stamp));
  fs.mkdirSync(dir, { recursive: true });
  const dump = which('mariadb-dump') ?? fail('mariadb-dump is missing (Debian package mariadb-client).');
  const sqlFile = path.join(dir, 'database.sql');
  const out = fs.openSync(sqlFile, 'w');
  const r = spawnSync(dump, ['--no-defaults', `--socket=${socket}`, '-uroot', '--single-transaction', '--routines', '--triggers', '--hex-blob', safeName(dbName)], { stdio: ['ignore', out, 'pipe'] });
  fs.closeSync(out);
  if (r.status !== 0) fail(`mariadb-dump failed: ${r.stderr}`);
  const withUploads = !inBucket && fs.existsSync(uploads);
  if (withUploads) fs.cpSync(uploads, path.join(dir, 'uploads'), { recursive: true });
  let objects = null;
  if (inBucket) {
    const copied = bucketCopy('export', dir);
    if (copied.error) fail(`Copying the bucket ${process.env.S3_BUCKET} failed: ${copied.error}`);
    objects = copied.count;
  }
  const files = { 'database.sql': sha256(sqlFile) };
  for (const f of contentsOf(dir)) files[f] = sha256(path.join(dir, f));
  fs.writeFileSync(
    path.join(dir, 'manifest.json'),
    `${JSON.stringify({ database: dbName, createdAt: new Date().toISOString(), uploads: withUploads, objects, sha256: files }, null, 2)}\n`,
  );
  log(`Backup of ${dbName} written to ${dir} (${Object.keys(files).length} files)`);
  process.stdout.write(`${dir}\n`);
}

/** Fails, before anything is changed, when a file of the backup is missing, extra or not what was written. */
function verify(dir) {
  const manifestFile = path.join(dir, 'manifest.json');
  if (!fs.existsSync(manifestFile)) fail(`${manifestFile} does not exist: not a backup folder. Nothing was restored.`);
  let manifest;
  try {
    manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8'));
  } catch {
    fail(`${manifestFile} is not valid JSON. Nothing was restored.`);
  }
  // Backups written before digests were recorded: only the dump's presence can be checked.
  if (!manifest.sha256) return manifest;
  const listed = Object.keys(manifest.sha256).sort();
  const present = ['database.sql', ...contentsOf(dir)].filter((f) => fs.existsSync(path.join(dir, f)));
  const missing = listed.filter((f) => !present.includes(f));
  const extra = present.filter((f) => !listed.includes(f));
  const changed = listed.filter((f) => present.includes(f) && sha256(path.join(dir, f)) !== manifest.sha256[f]);
  if (missing.length || extra.length || changed.length) {
    const say = (what, list) => (list.length ? `${what}: ${list.slice(0, 5).join(', ')}${list.length > 5 ? ` and ${list.length - 5} more` : ''}` : null);
    fail(
      `The backup in ${dir} does not match its manifest (${[say('missing', missing), say('not listed', extra), say('changed', changed)].filter(Boolean).join('; ')}). Nothing was restored.`,
    );
  }
  return manifest;
}

function restore() {
  const dir = path.resolve(arg('--from') ?? fail('Say which backup: npm run db:restore -- --from .data/backups/<folder>'));
  const sqlFile = path.join(dir, 'database.sql');
  if (!fs.existsSync(sqlFile)) fail(`${sqlFile} does not exist. Nothing was restored.`);
  const manifest = verify(dir);
  const target = safeName(arg('--into') ?? dbName);
  const staging = `${target}__restoring`;
  const replaced = `${target}__replaced`;
  const client = which('mariadb') ?? fail('The mariadb client is missing (Debian package mariadb-client).');
  const base = ['--no-defaults', `--socket=${socket}`, '-uroot'];
  const sql = (statements) => spawnSync(client, [...base, '-N', '-B', '-e', statements], { encoding: 'utf8' });
  const created = (db) => `CREATE DATABASE \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`;

  // 1. Load into a staging database; the live one is not touched yet.
  const prepared = sql(`DROP DATABASE IF EXISTS \`${staging}\`; ${created(staging)}`);
  if (prepared.status !== 0) fail(`Could not create the staging database ${staging}: ${prepared.stderr}`);
  const input = fs.openSync(sqlFile, 'r');
  const loaded = spawnSync(client, [...base, staging], { stdio: [input, 'inherit', 'pipe'] });
  fs.closeSync(input);
  if (loaded.status !== 0) {
    sql(`DROP DATABASE IF EXISTS \`${staging}\``);
    fail(`Loading the backup failed: ${String(loaded.stderr).trim()}. ${target} is unchanged.`);
  }

  // 2. The files beside it. Bucket objects go back into the bucket (they are named by the rows that use
  //    them, so putting them back before the swap only adds or rewrites the same objects); uploads are
  //    copied next to the live folder (same file system, so their swap is a rename).
  if (target === dbName && manifest.objects !== undefined && manifest.objects !== null) {
    const dropStaging = () => sql(`DROP DATABASE IF EXISTS \`${staging}\``);
    if (!inBucket) {
      dropStaging();
      fail(`This backup holds ${manifest.objects} objects of an S3 bucket: set S3_* to the bucket to restore them into. ${target} is unchanged.`);
    }
    const copied = bucketCopy('import', dir);
    if (copied.error) {
      dropStaging();
      fail(`Putting the objects back into ${process.env.S3_BUCKET} failed: ${copied.error}. ${target} is unchanged.`);
    }
  }
  const withUploads = target === dbName && fs.existsSync(path.join(dir, 'uploads'));
  const stagedUploads = `${uploads}.restoring`;
  if (withUploads) {
    fs.rmSync(stagedUploads, { recursive: true, force: true });
    fs.cpSync(path.join(dir, 'uploads'), stagedUploads, { recursive: true });
  }

  // 3. Swap: every table of the live database moves aside and every staged one takes its place, in one
  //    RENAME TABLE (atomic in MariaDB); then what was replaced is dropped.
  const tablesOf = (db) => {
    const r = sql(`SELECT table_name FROM information_schema.tables WHERE table_schema = '${db}' ORDER BY table_name`);
    if (r.status !== 0) fail(`Could not list the tables of ${db}: ${r.stderr}`);
    return r.stdout.split('\n').filter(Boolean);
  };
  const swap = sql(`CREATE DATABASE IF NOT EXISTS \`${target}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    DROP DATABASE IF EXISTS \`${replaced}\`; ${created(replaced)}`);
  if (swap.status !== 0) fail(`Could not prepare the swap: ${swap.stderr}. ${target} is unchanged.`);
  const moves = [
    ...tablesOf(target).map((t) => `\`${target}\`.\`${t}\` TO \`${replaced}\`.\`${t}\``),
    ...tablesOf(staging).map((t) => `\`${staging}\`.\`${t}\` TO \`${target}\`.\`${t}\``),
  ];
  const renamed = sql(`SET SESSION foreign_key_checks = 0; RENAME TABLE ${moves.join(', ')};`);
  if (renamed.status !== 0) {
    sql(`DROP DATABASE IF EXISTS \`${staging}\`; DROP DATABASE IF EXISTS \`${replaced}\``);
    if (withUploads) fs.rmSync(stagedUploads, { recursive: true, force: true });
    fail(`Could not swap the restored tables in: ${renamed.stderr}. ${target} is unchanged.`);
  }
  sql(`DROP DATABASE IF EXISTS \`${replaced}\`; DROP DATABASE IF EXISTS \`${staging}\``);
  if (withUploads) {
    const old = `${uploads}.replaced`;
    fs.rmSync(old, { recursive: true, force: true });
    if (fs.existsSync(uploads)) fs.renameSync(uploads, old);
    fs.renameSync(stagedUploads, uploads);
    fs.rmSync(old, { recursive: true, force: true });
  }
  log(`Restored ${dir} into ${target}.`);
}

const cmd = process.argv[2];
if (cmd === 'backup') backup();
else if (cmd === 'restore') restore();
else fail('Use: node scripts/backup.mjs backup|restore');
