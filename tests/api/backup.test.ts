import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
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

describe('backup and restore', () => {
  it('round-trips the database: same tables, row counts and checksums', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sf-backup-'));
    const env = { ...process.env, DB_NAME: apiTestEnv.DB_NAME, UPLOADS_DIR: apiTestEnv.UPLOADS_DIR };
    execFileSync(process.execPath, ['scripts/backup.mjs', 'backup', '--to', dir], {
      cwd: root,
      env,
      stdio: 'ignore',
    });
    expect(fs.statSync(path.join(dir, 'database.sql')).size).toBeGreaterThan(10_000);
    execFileSync(process.execPath, ['scripts/backup.mjs', 'restore', '--from', dir, '--into', restoredDb], {
      cwd: root,
      env,
      stdio: 'ignore',
    });
    const [original, restored] = [await fingerprint(apiTestEnv.DB_NAME), await fingerprint(restoredDb)];
    expect(Object.keys(restored)).toEqual(Object.keys(original));
    expect(restored).toEqual(original);
    expect(original.pv_strings!.rows).toBe(832);
    await sequelize.query(`DROP DATABASE \`${restoredDb}\``);
    fs.rmSync(dir, { recursive: true, force: true });
  }, 120_000);
});
