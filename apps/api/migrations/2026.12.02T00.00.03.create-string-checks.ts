import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

const ref = (table: string, allowNull = false, onDelete = 'RESTRICT') => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const dbl = () => ({ type: DataTypes.DOUBLE, allowNull: true });

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.createTable('instruments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(24), allowNull: false },
    serial: { type: DataTypes.STRING(80), allowNull: false },
    model: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    calibration_due_on: { type: DataTypes.DATEONLY, allowNull: false },
    is_archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('instruments', ['kind', 'serial'], { unique: true, name: 'instruments_kind_serial' });

  await qi.createTable('string_checks', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    client_id: { type: DataTypes.CHAR(36), allowNull: false, unique: true },
    work_order_id: ref('work_orders'),
    string_id: ref('pv_strings'),
    technician_id: ref('users'),
    phase: { type: DataTypes.ENUM('before', 'after'), allowNull: false },
    taken_at: { type: DataTypes.DATE(3), allowNull: false },
    voc_v: { type: DataTypes.DOUBLE, allowNull: false },
    isc_a: dbl(),
    operating_current_a: dbl(),
    operating_voltage_v: dbl(),
    irradiance_wm2: dbl(),
    irradiance_method: { type: DataTypes.STRING(24), allowNull: true },
    module_temp_c: dbl(),
    module_temp_method: { type: DataTypes.STRING(32), allowNull: true },
    ambient_c: dbl(),
    polarity_correct: { type: DataTypes.BOOLEAN, allowNull: false },
    insulation_plus_mohm: dbl(),
    insulation_minus_mohm: dbl(),
    insulation_test_voltage_v: dbl(),
    instrument_ids: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    notes: { type: DataTypes.TEXT, allowNull: false },
    // What the engine said when the check was saved, kept with the engine version.
    expected_json: { type: DataTypes.TEXT, allowNull: true },
    voc_deviation_pct: dbl(),
    isc_deviation_pct: dbl(),
    verdict: { type: DataTypes.ENUM('pass', 'attention', 'fail'), allowNull: false },
    findings_json: { type: DataTypes.TEXT, allowNull: false },
    peers_json: { type: DataTypes.TEXT, allowNull: false },
    is_calibration_overdue: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    supersedes_id: ref('string_checks', true),
    superseded_by_id: ref('string_checks', true),
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('string_checks', ['work_order_id', 'string_id', 'phase'], { name: 'string_checks_ticket' });
  await qi.addIndex('string_checks', ['string_id', 'taken_at'], { name: 'string_checks_string_time' });
  await qi.addIndex('string_checks', ['taken_at'], { name: 'string_checks_time' });

  await qi.createTable('iv_traces', {
    check_id: { ...ref('string_checks', false, 'CASCADE'), primaryKey: true },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    irradiance_wm2: { type: DataTypes.DOUBLE, allowNull: false },
    cell_temp_c: { type: DataTypes.DOUBLE, allowNull: false },
    points_json: { type: DataTypes.TEXT('medium'), allowNull: false },
    stc_points_json: { type: DataTypes.TEXT('medium'), allowNull: false },
    analysis_json: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.dropTable('iv_traces');
  await qi.dropTable('string_checks');
  await qi.dropTable('instruments');
};
