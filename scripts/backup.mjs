#!/usr/bin/env node
// npm run db:backup [-- --to DIR]   : mariadb-dump of DB_NAME (one consistent snapshot) + the uploads folder
//                                     (or, with S3_* set, every object of the bucket), with a manifest of
//                                     SHA-256 digests of every file
// npm run db:restore -- --from DIR [--into NAME] [--unverified] : load a backup into DB_NAME (or NAME),
//                                     replacing it, and put the uploads back beside it (only when restoring
//                                     into DB_NAME); --unverified accepts a backup whose manifest predates
//                                     the digests, provided its dump is complete
// A restore checks the backup against its manifest and loads it into a staging database first; only a
// complete load replaces the live database (one atomic RENAME TABLE) and the uploads folder, and if the
// uploads cannot be swapped in the tables are swapped back. A backup that is damaged, holds links, has no
// tables or fails to load leaves the database and the uploads as they were.
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
function verify(dir, { unverified }) {
  const manifestFile = path.join(dir, 'manifest.json');
  if (!fs.existsSync(manifestFile)) fail(`${manifestFile} does not exist: not a backup folder. Nothing was restored.`);
  let manifest;
  try {
    manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8'));
  } catch {
    fail(`${manifestFile} is not valid JSON. Nothing was restored.`);
  }
  // The digests only cover regular files: a link (or a device, a pipe) would be copied into the live
  // uploads as it is, pointing wherever it was made to point, so it is refused whatever the manifest says.
  const odd = fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => !e.isFile() && !e.isDirectory())
    .map((e) => `${path.relative(dir, path.join(e.parentPath ?? e.path, e.name))}${e.isSymbolicLink() ? ' (symbolic link)' : ''}`)
    .sort();
  if (odd.length) {
    fail(
      `The backup in ${dir} holds ${odd.length} entries that are not plain files or folders: ${odd.slice(0, 5).join(', ')}${odd.length > 5 ? ` and ${odd.length - 5} more` : ''}. A backup holds plain files and folders only; replace each link by the file it points to, or remove it. Nothing was restored.`,
    );
  }
  if (!manifest.sha256) {
    // Backups written before digests were recorded: nothing proves they are whole, so a person has to
    // say so, and even then a dump that stops before mariadb-dump's last line is certainly not whole.
    if (!unverified) {
      fail(
        `The manifest of ${dir} has no SHA-256 digests (the backup was written before they were recorded), so it cannot be checked. To restore it anyway, run the same command with --unverified; its database.sql must still end with mariadb-dump's "-- Dump completed" line. Nothing was restored.`,
      );
    }
    const sqlFile = path.join(dir, 'database.sql');
    const size = fs.statSync(sqlFile).size;
    const tail = Buffer.alloc(Math.min(size, 4096));
    const fd = fs.openSync(sqlFile, 'r');
    fs.readSync(fd, tail, 0, tail.length, size - tail.length);
    fs.closeSync(fd);
    const lastLine = tail.toString('utf8').trimEnd().split('\n').at(-1) ?? '';
    if (!lastLine.startsWith('-- Dump completed')) {
      fail(
        `${sqlFile} does not end with mariadb-dump's "-- Dump completed" line: the dump is cut off or was not written by mariadb-dump, and this backup has no digests to tell what is missing. Restore an older or newer backup instead. Nothing was restored.`,
      );
    }
    log(`${dir} has no digests: restoring it unverified (its dump is complete; its uploads are not checked).`);
    return manifest;
  }
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

/**
 * Where the uploads folder really is, and why its restore could not be a rename there. The restored
 * folder is staged beside the live one and swapped in by rename, which only works within one file system:
 * when the live folder is a mount point (a container volume, say), the staged copy would land on the
 * file system above it and the swap would fail after the tables were already swapped.
 */
function uploadsPlace(dir) {
  const parent = path.dirname(path.resolve(dir));
  if (!fs.existsSync(parent)) return { error: `the folder ${parent} that should hold the uploads folder ${dir} does not exist; create it, then run again` };
  const live = fs.existsSync(dir) ? fs.realpathSync(dir) : path.join(fs.realpathSync(parent), path.basename(dir));
  if (fs.existsSync(live)) {
    if (!fs.statSync(live).isDirectory()) return { live, error: `${live} is not a folder` };
    const [here, above] = [fs.statSync(live).dev, fs.statSync(path.dirname(live)).dev];
    if (here !== above) {
      return {
        live,
        error: `the uploads folder ${live} is on another file system than ${path.dirname(live)} (a mount point), so the restored uploads cannot be swapped in by a rename. Mount the volume one folder higher and point UPLOADS_DIR at a folder inside it`,
      };
    }
  }
  return { live, staged: `${live}.restoring`, old: `${live}.replaced` };
}

function restore() {
  const dir = path.resolve(arg('--from') ?? fail('Say which backup: npm run db:restore -- --from .data/backups/<folder>'));
  const sqlFile = path.join(dir, 'database.sql');
  if (!fs.existsSync(sqlFile)) fail(`${sqlFile} does not exist. Nothing was restored.`);
  const manifest = verify(dir, { unverified: process.argv.includes('--unverified') });
  const target = safeName(arg('--into') ?? dbName);
  const staging = `${target}__restoring`;
  const replaced = `${target}__replaced`;
  const withUploads = target === dbName && fs.existsSync(path.join(dir, 'uploads'));
  const place = withUploads ? uploadsPlace(uploads) : null;
  if (place?.error) fail(`Cannot restore the uploads: ${place.error}. Nothing was restored.`);
  // What an earlier restore set aside and did not get to remove may be the only copy of something.
  if (place && fs.existsSync(place.old)) {
    fail(`${place.old} is left from an earlier restore that did not finish: it may hold the only copy of uploads. Look at it, move it away or delete it, then restore again. Nothing was restored.`);
  }
  const client = which('mariadb') ?? fail('The mariadb client is missing (Debian package mariadb-client).');
  const base = ['--no-defaults', `--socket=${socket}`, '-uroot'];
  const sql = (statements) => spawnSync(client, [...base, '-N', '-B', '-e', statements], { encoding: 'utf8' });
  const created = (db) => `CREATE DATABASE \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`;
  const listTables = (db) => {
    const r = sql(`SELECT table_name FROM information_schema.tables WHERE table_schema = '${db}' ORDER BY table_name`);
    return r.status === 0 ? { tables: r.stdout.split('\n').filter(Boolean) } : { error: r.stderr.trim() };
  };
  const tablesOf = (db) => {
    const r = listTables(db);
    if (r.error) fail(`Could not list the tables of ${db}: ${r.error}. ${target} is unchanged.`);
    return r.tables;
  };
  const dropStaging = () => sql(`DROP DATABASE IF EXISTS \`${staging}\``);
  if (tablesOf(replaced).length) {
    fail(`${replaced} is left from an earlier restore that did not finish and still holds tables: they may be the only copy of them. Look at it, move what you need back into ${target}, drop ${replaced}, then restore again. Nothing was restored.`);
  }

  // 1. Load into a staging database; the live one is not touched yet.
  const prepared = sql(`DROP DATABASE IF EXISTS \`${staging}\`; ${created(staging)}`);
  if (prepared.status !== 0) fail(`Could not create the staging database ${staging}: ${prepared.stderr}`);
  const input = fs.openSync(sqlFile, 'r');
  const loaded = spawnSync(client, [...base, staging], { stdio: [input, 'inherit', 'pipe'] });
  fs.closeSync(input);
  if (loaded.status !== 0) {
    dropStaging();
    fail(`Loading the backup failed: ${String(loaded.stderr).trim()}. ${target} is unchanged.`);
  }
  const restoredTables = tablesOf(staging);
  if (!restoredTables.length) {
    // Swapping it in would empty the live database.
    dropStaging();
    fail(`${sqlFile} loaded without creating a single table: not a backup of a Stringfield database. Nothing was restored; ${target} is unchanged.`);
  }

  // 2. The files beside it. Bucket objects go back into the bucket (they are named by the rows that use
  //    them, so putting them back before the swap only adds or rewrites the same objects); uploads are
  //    copied next to the live folder (same file system, checked above, so their swap is a rename).
  if (target === dbName && manifest.objects !== undefined && manifest.objects !== null) {
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
  if (withUploads) {
    try {
      fs.rmSync(place.staged, { recursive: true, force: true });
      fs.cpSync(path.join(dir, 'uploads'), place.staged, { recursive: true });
      // Something mounted where the copy was to go would put it on another file system after all.
      if (fs.existsSync(place.live) && fs.statSync(place.staged).dev !== fs.statSync(place.live).dev) {
        throw new Error(`${place.staged} is on another file system than ${place.live}, so it cannot be swapped in by a rename`);
      }
    } catch (e) {
      dropStaging();
      fs.rmSync(place.staged, { recursive: true, force: true });
      fail(`Copying the uploads to ${place.staged} failed: ${e.message}. ${target} and ${place.live} are unchanged.`);
    }
  }

  // 3. Swap: every table of the live database moves aside and every staged one takes its place, in one
  //    RENAME TABLE (atomic in MariaDB). What was replaced is kept until the uploads are swapped too, so
  //    that a failure there can still put the tables back.
  const swap = sql(`CREATE DATABASE IF NOT EXISTS \`${target}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    DROP DATABASE IF EXISTS \`${replaced}\`; ${created(replaced)}`);
  if (swap.status !== 0) {
    dropStaging();
    if (withUploads) fs.rmSync(place.staged, { recursive: true, force: true });
    fail(`Could not prepare the swap: ${swap.stderr}. ${target} is unchanged.`);
  }
  const liveTables = tablesOf(target);
  const moves = (pairs) => `SET SESSION foreign_key_checks = 0; RENAME TABLE ${pairs.map(([from, to, t]) => `\`${from}\`.\`${t}\` TO \`${to}\`.\`${t}\``).join(', ')};`;
  const swapIn = [...liveTables.map((t) => [target, replaced, t]), ...restoredTables.map((t) => [staging, target, t])];
  // Only an empty database is dropped: whatever is in it may be the only copy of the live tables.
  const dropIfEmpty = (db) => {
    const r = listTables(db);
    if (r.error || r.tables.length) return r.error ?? `${r.tables.length} tables`;
    sql(`DROP DATABASE IF EXISTS \`${db}\``);
    return null;
  };
  const renamed = sql(moves(swapIn));
  if (renamed.status !== 0) {
    dropStaging();
    if (withUploads) fs.rmSync(place.staged, { recursive: true, force: true });
    const kept = dropIfEmpty(replaced);
    if (kept) {
      fail(
        `Could not swap the restored tables in: ${renamed.stderr.trim()}. ${replaced} was kept because it is not known to be empty (${kept}): it may hold tables of ${target}. Compare ${target} and ${replaced} and move any table back before dropping ${replaced}.`,
      );
    }
    fail(`Could not swap the restored tables in: ${renamed.stderr.trim()}. ${target} is unchanged.`);
  }

  // 4. The uploads, by two renames; if either fails, the tables and the old uploads go back.
  if (withUploads) {
    const { live, staged, old } = place;
    let movedAside = false;
    try {
      if (fs.existsSync(live)) {
        fs.renameSync(live, old);
        movedAside = true;
      }
      fs.renameSync(staged, live);
    } catch (e) {
      const problems = [];
      if (movedAside) {
        try {
          fs.renameSync(old, live);
        } catch (back) {
          problems.push(`the previous uploads could not be moved back from ${old} to ${live} (${back.message}): move them back by hand`);
        }
      }
      const back = sql(moves([...restoredTables.map((t) => [target, staging, t]), ...liveTables.map((t) => [replaced, target, t])]));
      if (back.status !== 0) {
        problems.push(
          `the tables could not be swapped back (${back.stderr.trim()}): ${target} holds the restored tables and ${replaced} the previous ones; move them back with RENAME TABLE`,
        );
      } else {
        dropStaging();
        const kept = dropIfEmpty(replaced);
        if (kept) problems.push(`${replaced} was kept because it is not known to be empty (${kept})`);
      }
      fs.rmSync(staged, { recursive: true, force: true });
      fail(
        problems.length
          ? `Swapping in the restored uploads failed: ${e.message}. Then ${problems.join('; and ')}.`
          : `Swapping in the restored uploads failed: ${e.message}. The tables were swapped back: ${target} and ${live} are as they were.`,
      );
    }
  }
  sql(`DROP DATABASE IF EXISTS \`${replaced}\`; DROP DATABASE IF EXISTS \`${staging}\``);
  if (withUploads) fs.rmSync(place.old, { recursive: true, force: true });
  log(`Restored ${dir} into ${target}.`);
}

const cmd = process.argv[2];
if (cmd === 'backup') backup();
else if (cmd === 'restore') restore();
else fail('Use: node scripts/backup.mjs backup|restore');
