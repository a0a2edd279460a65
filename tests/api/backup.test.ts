import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../apps/api/src/models/index.ts';
import { resetDatabase } from './helpers.ts';
import { apiTestEnv } from './test-env.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const restoredDb = `${apiTestEnv.DB_NAME}_restore_check`;

async function fingerprint(db: string) {
  const tables = await sequelize.query<{ t: string }>(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY table_name",
    { replacements: [db], type: QueryTypes.SELECT },
  );
  const out: Record<string, { rows: number; checksum: number }> = {};
  for (const { t } of tables) {
    const [count] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${db}\`.\`${t}\``, {
      type: QueryTypes.SELECT,
    });
    const [sum] = await sequelize.query<{ Checksum: number }>(`CHECKSUM TABLE \`${db}\`.\`${t}\``, {
      type: QueryTypes.SELECT,
    });
    out[t] = { rows: Number(count!.n), checksum: Number(sum!.Checksum) };
  }
  return out;
}

beforeAll(async () => {
  await resetDatabase({ plant: true });
});

const run = (args: string[], env: Record<string, string | undefined>) =>
  spawnSync(process.execPath, ['scripts/backup.mjs', ...args], { cwd: root, env: { ...process.env, ...env }, encoding: 'utf8' });
const databases = async () =>
  (await sequelize.query<{ d: string }>('SELECT schema_name AS d FROM information_schema.schemata', { type: QueryTypes.SELECT })).map(
    (r) => r.d,
  );

describe('backup and restore', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-backup-'));
  const env = { DB_NAME: apiTestEnv.DB_NAME, UPLOADS_DIR: apiTestEnv.UPLOADS_DIR };
  const live = `${apiTestEnv.DB_NAME}_restore_live`;
  const liveUploads = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-restore-uploads-'));
  const liveEnv = { DB_NAME: live, UPLOADS_DIR: liveUploads };
  afterAll(async () => {
    await sequelize.query(`DROP DATABASE IF EXISTS \`${restoredDb}\``);
    await sequelize.query(`DROP DATABASE IF EXISTS \`${live}\``);
    for (const d of [dir, liveUploads, `${liveUploads}.restoring`, `${liveUploads}.replaced`]) fs.rmSync(d, { recursive: true, force: true });
  });
  const list = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d, { recursive: true }).map(String).sort() : []);
  const leftovers = async () => (await databases()).filter((d) => d.startsWith(`${live}__`));
  /** Makes the live installation differ from the backup, so that a restore that goes ahead shows. */
  const diverge = async () => {
    await sequelize.query(`DELETE FROM \`${live}\`.string_checks`);
    fs.writeFileSync(path.join(liveUploads, 'written-after-the-backup.jpg'), 'x');
    const state = { db: await fingerprint(live), uploads: list(liveUploads) };
    expect(state.db).not.toEqual(await fingerprint(apiTestEnv.DB_NAME));
    return state;
  };
  const expectUnchanged = async (state: Awaited<ReturnType<typeof diverge>>) => {
    expect(await fingerprint(live)).toEqual(state.db);
    expect(list(liveUploads)).toEqual(state.uploads);
    expect(await leftovers()).toEqual([]);
    expect(fs.existsSync(`${liveUploads}.restoring`)).toBe(false);
    expect(fs.existsSync(`${liveUploads}.replaced`)).toBe(false);
  };
  /** A copy of the backup, changed by `change`, removed after `use`. */
  const withCopy = async (change: (copy: string) => void, use: (copy: string) => Promise<void>) => {
    const copy = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-backup-copy-'));
    try {
      fs.cpSync(dir, copy, { recursive: true });
      change(copy);
      await use(copy);
    } finally {
      fs.rmSync(copy, { recursive: true, force: true });
    }
  };
  /** The manifest as backups written before digests were recorded had it. */
  const withoutDigests = (copy: string) => {
    const manifestFile = path.join(copy, 'manifest.json');
    const { sha256: _digests, ...manifest } = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Record<string, unknown>;
    fs.writeFileSync(manifestFile, JSON.stringify(manifest));
  };

  it('round-trips the database: same tables, row counts and checksums', async () => {
    const made = run(['backup', '--to', dir], env);
    expect(made.status, made.stderr).toBe(0);
    expect(fs.statSync(path.join(dir, 'database.sql')).size).toBeGreaterThan(10_000);
    const manifest = JSON.parse(fs.readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as { sha256: Record<string, string> };
    expect(manifest.sha256['database.sql']).toMatch(/^[0-9a-f]{64}$/);
    const restored = run(['restore', '--from', dir, '--into', restoredDb], env);
    expect(restored.status, restored.stderr).toBe(0);
    const [original, copy] = [await fingerprint(apiTestEnv.DB_NAME), await fingerprint(restoredDb)];
    expect(Object.keys(copy)).toEqual(Object.keys(original));
    expect(copy).toEqual(original);
    expect(original.pv_strings!.rows).toBe(832);
  }, 120_000);

  it('replaces a live database and its uploads folder in one swap', async () => {
    // A "live" installation of its own: its database from the backup, then changed, with a stray upload.
    expect(run(['restore', '--from', dir, '--into', live], env).status).toBe(0);
    await sequelize.query(`DELETE FROM \`${live}\`.string_checks`);
    fs.writeFileSync(path.join(liveUploads, 'written-after-the-backup.jpg'), 'x');
    const r = run(['restore', '--from', dir], { DB_NAME: live, UPLOADS_DIR: liveUploads });
    expect(r.status, r.stderr).toBe(0);
    expect(await fingerprint(live)).toEqual(await fingerprint(apiTestEnv.DB_NAME));
    expect(list(liveUploads)).toEqual(list(path.join(dir, 'uploads')));
    expect((await databases()).filter((d) => d.startsWith(`${live}__`))).toEqual([]);
  }, 120_000);

  it('refuses a damaged backup and leaves the database as it was', async () => {
    await sequelize.query(`DELETE FROM \`${live}\`.string_checks`); // the state a failed restore must keep
    const before = await fingerprint(live);
    const damaged = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-backup-damaged-'));
    try {
      fs.cpSync(dir, damaged, { recursive: true });
      const sqlFile = path.join(damaged, 'database.sql');
      fs.truncateSync(sqlFile, Math.floor(fs.statSync(sqlFile).size / 2)); // a copy cut off half-way
      const r = run(['restore', '--from', damaged], { DB_NAME: live, UPLOADS_DIR: liveUploads });
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/does not match its manifest \(changed: database\.sql\)\. Nothing was restored/);
      expect(await fingerprint(live)).toEqual(before);
    } finally {
      fs.rmSync(damaged, { recursive: true, force: true });
    }
  }, 120_000);

  it('keeps the database when a dump that matches its manifest fails to load', async () => {
    const before = await fingerprint(live);
    const broken = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-backup-broken-'));
    try {
      fs.cpSync(dir, broken, { recursive: true });
      const sqlFile = path.join(broken, 'database.sql');
      // Valid up to the last statement, then not SQL: what a dump written by a broken tool could hold.
      fs.appendFileSync(sqlFile, '\nTHIS IS NOT SQL;\n');
      const manifestFile = path.join(broken, 'manifest.json');
      const manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as { sha256: Record<string, string> };
      manifest.sha256['database.sql'] = createHash('sha256').update(fs.readFileSync(sqlFile)).digest('hex');
      fs.writeFileSync(manifestFile, JSON.stringify(manifest));
      const r = run(['restore', '--from', broken], { DB_NAME: live, UPLOADS_DIR: liveUploads });
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/Loading the backup failed: .*You have an error in your SQL syntax.*is unchanged/s);
      expect(await fingerprint(live)).toEqual(before);
      expect((await databases()).filter((d) => d.startsWith(`${live}__`))).toEqual([]);
      expect(fs.existsSync(`${liveUploads}.restoring`)).toBe(false);
    } finally {
      fs.rmSync(broken, { recursive: true, force: true });
    }
  }, 120_000);

  it('refuses a backup whose manifest has no digests unless --unverified is given', async () => {
    const state = await diverge();
    await withCopy(withoutDigests, async (copy) => {
      const r = run(['restore', '--from', copy], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/has no SHA-256 digests .*cannot be checked\. To restore it anyway, run the same command with --unverified.*Nothing was restored/);
      await expectUnchanged(state);
    });
  }, 120_000);

  it('restores a backup without digests with --unverified when its dump is complete, and says it was not checked', async () => {
    await diverge();
    await withCopy(withoutDigests, async (copy) => {
      const r = run(['restore', '--from', copy, '--unverified'], liveEnv);
      expect(r.status, r.stderr).toBe(0);
      expect(r.stdout).toMatch(/has no digests: restoring it unverified/);
      expect(await fingerprint(live)).toEqual(await fingerprint(apiTestEnv.DB_NAME));
      expect(list(liveUploads)).toEqual(list(path.join(dir, 'uploads')));
      expect(await leftovers()).toEqual([]);
    });
  }, 120_000);

  it('refuses a backup without digests, even with --unverified, when its dump is cut off', async () => {
    const state = await diverge();
    const cut = (copy: string) => {
      withoutDigests(copy);
      // Cut at the end of a table's data: what is left loads cleanly, it just lacks the later tables.
      const sqlFile = path.join(copy, 'database.sql');
      const text = fs.readFileSync(sqlFile, 'utf8');
      const end = text.lastIndexOf('\nUNLOCK TABLES;\n', text.length / 2);
      expect(end).toBeGreaterThan(0);
      fs.writeFileSync(sqlFile, text.slice(0, end + '\nUNLOCK TABLES;\n'.length));
    };
    await withCopy(cut, async (copy) => {
      const r = run(['restore', '--from', copy, '--unverified'], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/does not end with mariadb-dump's "-- Dump completed" line: the dump is cut off.*Nothing was restored/);
      await expectUnchanged(state);
    });
  }, 120_000);

  it('refuses a backup whose uploads hold a symbolic link and leaves the database as it was', async () => {
    const state = await diverge();
    const link = (copy: string) => {
      fs.mkdirSync(path.join(copy, 'uploads'), { recursive: true });
      fs.symlinkSync('/etc/hostname', path.join(copy, 'uploads', 'linked.jpg'));
    };
    await withCopy(link, async (copy) => {
      const r = run(['restore', '--from', copy], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/holds 1 entries that are not plain files or folders: uploads\/linked\.jpg \(symbolic link\)\. A backup holds plain files and folders only.*Nothing was restored/);
      await expectUnchanged(state);
    });
  }, 120_000);

  it('refuses to restore over what an earlier, unfinished restore set aside', async () => {
    const state = await diverge();
    // Uploads moved aside by a restore that stopped before removing them.
    fs.mkdirSync(`${liveUploads}.replaced`);
    fs.writeFileSync(path.join(`${liveUploads}.replaced`, 'only-copy.jpg'), 'x');
    try {
      const r = run(['restore', '--from', dir], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/\.replaced is left from an earlier restore that did not finish.*Nothing was restored/s);
      expect(fs.readdirSync(`${liveUploads}.replaced`)).toEqual(['only-copy.jpg']);
    } finally {
      fs.rmSync(`${liveUploads}.replaced`, { recursive: true, force: true });
    }
    // Tables moved aside by a restore that stopped before dropping them.
    await sequelize.query(`CREATE DATABASE \`${live}__replaced\``);
    await sequelize.query(`CREATE TABLE \`${live}__replaced\`.comments (id INT PRIMARY KEY)`);
    try {
      const r = run(['restore', '--from', dir], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/__replaced is left from an earlier restore that did not finish and still holds tables.*Nothing was restored/s);
      expect(await databases()).toContain(`${live}__replaced`);
    } finally {
      await sequelize.query(`DROP DATABASE IF EXISTS \`${live}__replaced\``);
    }
    await expectUnchanged(state);
  }, 120_000);

  it('refuses a backup of a database without tables instead of emptying the live one', async () => {
    const state = await diverge();
    const empty = `${apiTestEnv.DB_NAME}_restore_empty`;
    const emptyBackup = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-backup-empty-'));
    try {
      await sequelize.query(`DROP DATABASE IF EXISTS \`${empty}\``);
      await sequelize.query(`CREATE DATABASE \`${empty}\``);
      const made = run(['backup', '--to', emptyBackup], { DB_NAME: empty, UPLOADS_DIR: path.join(emptyBackup, 'no-uploads') });
      expect(made.status, made.stderr).toBe(0);
      const r = run(['restore', '--from', emptyBackup], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/loaded without creating a single table: not a backup of a Stringfield database\. Nothing was restored/);
      await expectUnchanged(state);
    } finally {
      await sequelize.query(`DROP DATABASE IF EXISTS \`${empty}\``);
      fs.rmSync(emptyBackup, { recursive: true, force: true });
    }
  }, 120_000);

  it('refuses up front when the live uploads folder is a mount point, before anything is changed', async ({ skip }) => {
    const state = await diverge();
    const parent = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-restore-mounted-'));
    const mounted = path.join(parent, 'uploads');
    fs.mkdirSync(mounted);
    // A file system of its own where the uploads live, as a container volume would be.
    const mount = spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=4m', 'tmpfs', mounted], { encoding: 'utf8' });
    try {
      if (mount.status !== 0) skip(`cannot mount a tmpfs here: ${mount.stderr || mount.error}`);
      fs.writeFileSync(path.join(mounted, 'on-the-volume.jpg'), 'x');
      const r = run(['restore', '--from', dir], { DB_NAME: live, UPLOADS_DIR: mounted });
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/Cannot restore the uploads: the uploads folder .* is on another file system than .* \(a mount point\).*Mount the volume one folder higher.*Nothing was restored/s);
      await expectUnchanged(state);
      expect(list(mounted)).toEqual(['on-the-volume.jpg']);
      expect(fs.readdirSync(parent)).toEqual(['uploads']);
    } finally {
      if (mount.status === 0) spawnSync('umount', [mounted]);
      fs.rmSync(parent, { recursive: true, force: true });
    }
  }, 120_000);

  it('swaps the tables back when the uploads folder cannot be swapped in', async ({ skip }) => {
    const state = await diverge();
    // An immutable folder cannot be renamed, even by root: the rename after the table swap really fails.
    const locked = spawnSync('chattr', ['+i', liveUploads], { encoding: 'utf8' });
    try {
      if (locked.status !== 0) skip(`cannot make a folder immutable here: ${locked.stderr || locked.error}`);
      const r = run(['restore', '--from', dir], liveEnv);
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(/Swapping in the restored uploads failed: EPERM.*The tables were swapped back: .* are as they were/);
      await expectUnchanged(state);
    } finally {
      if (locked.status === 0) spawnSync('chattr', ['-i', liveUploads]);
    }
  }, 120_000);
});
