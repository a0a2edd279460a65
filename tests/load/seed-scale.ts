// npm run seed:scale — an invented fleet for the benchmarks: 50 sites, 20,000 strings, 100,000 work
// orders and 1,000,000 string checks, written with set-based INSERT … SELECT over MariaDB's sequence
// engine (seq_1_to_N), so it takes seconds to minutes rather than hours.
// Runs against DB_NAME (default stringfield_bench); it drops and recreates that database.
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Sequelize } from 'sequelize';
// The API's connector: Sequelize's raw queries need its deletable `meta` (see withDeletableMeta).
import { connector } from '../../apps/api/src/lib/mariadb-connector.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const benchDb = process.env.DB_NAME ?? 'stringfield_bench';
const scale = {
  sites: Number(process.env.SCALE_SITES ?? 50),
  invertersPerSite: 20,
  stringsPerInverter: 20,
  workOrders: Number(process.env.SCALE_WORK_ORDERS ?? 100_000),
  checks: Number(process.env.SCALE_CHECKS ?? 1_000_000),
};

function log(msg: string) {
  process.stdout.write(`[seed:scale] ${msg}\n`);
}

export async function seedScale(): Promise<Record<string, number>> {
  const started = Date.now();
  const admin = new Sequelize('', process.env.DB_USER ?? 'stringfield', process.env.DB_PASSWORD ?? 'stringfield-local', {
    dialect: 'mariadb',
    dialectModule: connector,
    host: '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3307),
    logging: false,
  });
  await admin.query(`DROP DATABASE IF EXISTS \`${benchDb}\``);
  await admin.query(`CREATE DATABASE \`${benchDb}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();
  const env = { ...process.env, DB_NAME: benchDb, LOG_LEVEL: 'warn' };
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/cli/migrate.ts', 'up'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['apps/api/src/cli/seed.ts'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
  log(`migrated and seeded the demo in ${((Date.now() - started) / 1000).toFixed(1)} s`);

  const db = new Sequelize(benchDb, process.env.DB_USER ?? 'stringfield', process.env.DB_PASSWORD ?? 'stringfield-local', {
    dialect: 'mariadb',
    dialectModule: connector,
    host: '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3307),
    logging: false,
    dialectOptions: { bigIntAsNumber: true, decimalAsNumber: true },
  });
  const q = async (label: string, sql: string) => {
    const t = Date.now();
    await db.query(sql);
    log(`${label}: ${((Date.now() - t) / 1000).toFixed(1)} s`);
  };
  const one = async (sql: string) => Number(((await db.query(sql)) as unknown as [[Record<string, number>]])[0][0].n);
  const moduleId = await one("SELECT id AS n FROM module_models WHERE model = 'SDM-405-72M'");
  const inverterModelId = await one("SELECT id AS n FROM inverter_models WHERE model = 'SDI-125K-6'");
  const dispatcherId = await one("SELECT id AS n FROM users WHERE email = 'dispatcher@stringfield.test'");
  const techIds = ((await db.query("SELECT id FROM users WHERE role = 'technician' ORDER BY id")) as unknown as [Array<{ id: number }>])[0].map((r) => r.id);
  await db.query('SET SESSION foreign_key_checks = 0, unique_checks = 0');

  await q(
    `${scale.sites} sites`,
    `INSERT INTO sites (name, code, address, time_zone, lowest_ambient_c, highest_ambient_c, design_irradiance_wm2, peak_sun_hours, owner_contact_email, is_archived, created_at, updated_at)
     SELECT CONCAT('Scale Field ', seq), CONCAT('Z', LPAD(seq, 3, '0')), 'Invented benchmark site', 'Europe/Berlin', -15, 36, 1000, 4.5, 'owner@stringfield.test', 0, NOW(), NOW()
       FROM seq_1_to_${scale.sites}`,
  );
  await q(
    `${scale.sites * scale.invertersPerSite} inverters`,
    `INSERT INTO inverters (site_id, tag, inverter_model_id, serial, is_archived, created_at, updated_at)
     SELECT s.id, CONCAT('INV', LPAD(k.seq, 2, '0')), ${inverterModelId}, CONCAT(s.code, '-', k.seq), 0, NOW(), NOW()
       FROM sites s JOIN seq_1_to_${scale.invertersPerSite} k WHERE s.code LIKE 'Z%'`,
  );
  await q(
    `${scale.sites * scale.invertersPerSite * scale.stringsPerInverter} strings`,
    `INSERT INTO pv_strings (site_id, inverter_id, mppt_input, combiner_box_id, combiner_position, label, module_model_id, modules_in_series, strings_in_parallel, commissioned_on, notes, is_archived, created_at, updated_at)
     SELECT i.site_id, i.id, 1 + (k.seq - 1) % 6, NULL, NULL, CONCAT(i.tag, '-MPPT', 1 + (k.seq - 1) % 6, '-S', k.seq), ${moduleId}, 25, 4, '2022-05-01', '', 0, NOW(), NOW()
       FROM inverters i JOIN sites s ON s.id = i.site_id JOIN seq_1_to_${scale.stringsPerInverter} k WHERE s.code LIKE 'Z%'`,
  );
  const firstString = await one("SELECT MIN(p.id) AS n FROM pv_strings p JOIN sites s ON s.id = p.site_id WHERE s.code LIKE 'Z%'");
  const firstSite = await one("SELECT MIN(id) AS n FROM sites WHERE code LIKE 'Z%'");
  const stringCount = scale.sites * scale.invertersPerSite * scale.stringsPerInverter;
  const stringsPerSite = scale.invertersPerSite * scale.stringsPerInverter;
  const techList = techIds.join(',');
  // Ticket k sits on string (k mod 20,000), so its site is that string's site; states, priorities and
  // categories cycle so that every filter has something to find.
  await q(
    `${scale.workOrders} work orders`,
    `INSERT INTO work_orders (number, site_id, fault_category, priority, title, description, source, status, reported_at, due_at, assignee_id, created_by_id,
                              dispatched_at, submitted_at, signed_off_at, return_count, overdue_notified_at, pending_offline_count, version, created_at, updated_at)
     SELECT CONCAT('WO-Z-', LPAD(seq, 7, '0')),
            ${firstSite} + FLOOR((seq % ${stringCount}) / ${stringsPerSite}),
            ELT(1 + seq % 12, 'open_circuit','low_voltage','low_current','reverse_polarity','insulation_ground_fault','bypass_diode_failure','hot_spot','physical_damage','connector_cable_damage','fuse','shading_soiling','other'),
            ELT(1 + seq % 4, 'P1','P2','P3','P4'),
            CONCAT('Benchmark ticket ', seq), '', 'monitoring_alert',
            ELT(1 + seq % 10, 'signed_off','signed_off','signed_off','signed_off','signed_off','reported','dispatched','in_field','awaiting_signoff','returned'),
            NOW() - INTERVAL (seq % 400) DAY - INTERVAL (seq % 24) HOUR,
            NOW() - INTERVAL (seq % 400) DAY + INTERVAL (24 - seq % 24) HOUR,
            ELT(1 + seq % ${techIds.length}, ${techList}), ${dispatcherId},
            NOW() - INTERVAL (seq % 400) DAY - INTERVAL (seq % 24) HOUR + INTERVAL 2 HOUR,
            IF(seq % 10 < 5 OR seq % 10 = 8, NOW() - INTERVAL (seq % 400) DAY + INTERVAL 6 HOUR, NULL),
            IF(seq % 10 < 5, NOW() - INTERVAL (seq % 400) DAY + INTERVAL 20 HOUR, NULL),
            IF(seq % 17 = 0, 1, 0), NOW(), 0, 0, NOW(), NOW()
       FROM seq_1_to_${scale.workOrders}`,
  );
  const firstWo = await one("SELECT MIN(id) AS n FROM work_orders WHERE number LIKE 'WO-Z-%'");
  await q(
    'ticket strings',
    `INSERT INTO work_order_strings (work_order_id, string_id, symptom)
     SELECT w.id, ${firstString} + ((w.id - ${firstWo} + 1) % ${stringCount}), 'benchmark'
       FROM work_orders w WHERE w.number LIKE 'WO-Z-%'`,
  );
  await q(
    `${scale.checks} string checks`,
    `INSERT INTO string_checks (client_id, work_order_id, string_id, technician_id, phase, taken_at, voc_v, isc_a, operating_current_a, operating_voltage_v,
                                irradiance_wm2, irradiance_method, module_temp_c, module_temp_method, ambient_c, polarity_correct, insulation_plus_mohm, insulation_minus_mohm,
                                insulation_test_voltage_v, instrument_ids, notes, expected_json, voc_deviation_pct, isc_deviation_pct, verdict, findings_json, peers_json,
                                is_calibration_overdue, engine_version, supersedes_id, superseded_by_id, created_at, updated_at)
     SELECT UUID(), ${firstWo} + (seq % ${scale.workOrders}), ${firstString} + (((seq % ${scale.workOrders}) + 1) % ${stringCount}), ${techIds[0]},
            IF(seq % 2 = 0, 'before', 'after'), NOW() - INTERVAL (seq % 400) DAY + INTERVAL (seq % 600) MINUTE,
            1180 + (seq % 60), 9.5 + (seq % 10) / 10, NULL, NULL, 850 + (seq % 150), 'reference_cell', 40 + (seq % 15), 'back_sensor', NULL, 1, NULL, NULL, NULL, '', '',
            '{"vocV":1200,"iscA":10,"vmpV":1000,"impA":9.5,"pmpW":9500}', -2 + (seq % 40) / 10, -1 + (seq % 20) / 10,
            ELT(1 + seq % 10, 'pass','pass','pass','pass','pass','pass','pass','attention','attention','fail'), '[]', '[]', 0, '1.0.0', NULL, NULL, NOW(), NOW()
       FROM seq_1_to_${scale.checks}`,
  );
  const { REPEAT_BACKFILL_SQL } = await import('../../apps/api/src/lib/repeat-faults.ts');
  await q('repeat faults', REPEAT_BACKFILL_SQL);
  await db.query('SET SESSION foreign_key_checks = 1, unique_checks = 1');
  await q('analyze tables', 'ANALYZE TABLE work_orders, work_order_strings, string_checks, pv_strings');
  const counts = {
    sites: await one('SELECT COUNT(*) AS n FROM sites'),
    strings: await one('SELECT COUNT(*) AS n FROM pv_strings'),
    workOrders: await one('SELECT COUNT(*) AS n FROM work_orders'),
    checks: await one('SELECT COUNT(*) AS n FROM string_checks'),
  };
  await db.close();
  log(`done in ${((Date.now() - started) / 1000).toFixed(1)} s: ${JSON.stringify(counts)}`);
  return counts;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  await seedScale();
}
