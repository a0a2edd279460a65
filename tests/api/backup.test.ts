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
  afterAll(async () => {
    await sequelize.query(`DROP DATABASE IF EXISTS \`${restoredDb}\``);
    await sequelize.query(`DROP DATABASE IF EXISTS \`${live}\``);
    for (const d of [dir, liveUploads, `${liveUploads}.restoring`]) fs.rmSync(d, { recursive: true, force: true });
  });

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
    const list = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d, { recursive: true }).map(String).sort() : []);
    expect(list(liveUploads)).toEqual(list(path.join(dir, 'uploads')));
    expect((await databases()).filter((d) => d.startsWith(`${live}__`))).toEqual([]);
  }, 120_000);

  it('refuses a damaged backup and leaves the database as it was', async () => {
    await sequelize.query(`DELETE FROM \`${live}\`.comments`); // the state a failed restore must keep
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
});
