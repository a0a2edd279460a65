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

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.createTable('photos', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    work_order_id: ref('work_orders'),
    string_id: ref('pv_strings', true),
    module_position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    tag: { type: DataTypes.ENUM('before', 'after', 'thermal', 'nameplate', 'other'), allowNull: false },
    caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    original_key: { type: DataTypes.STRING(200), allowNull: false },
    original_type: { type: DataTypes.STRING(40), allowNull: false },
    screen_key: { type: DataTypes.STRING(200), allowNull: false },
    thumb_key: { type: DataTypes.STRING(200), allowNull: false },
    width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    captured_at: { type: DataTypes.DATE, allowNull: true },
    gps_lat: { type: DataTypes.DOUBLE, allowNull: true },
    gps_lon: { type: DataTypes.DOUBLE, allowNull: true },
    uploaded_by_id: ref('users'),
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('photos', ['work_order_id', 'tag'], { name: 'photos_ticket_tag' });
  await qi.addIndex('photos', ['string_id'], { name: 'photos_string' });

  await qi.createTable('thermal_findings', {
    photo_id: { ...ref('photos', false, 'CASCADE'), primaryKey: true },
    hottest_c: { type: DataTypes.DOUBLE, allowNull: false },
    reference_c: { type: DataTypes.DOUBLE, allowNull: false },
    irradiance_wm2: { type: DataTypes.DOUBLE, allowNull: false },
    pattern: { type: DataTypes.STRING(24), allowNull: false },
    module_position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    class_of_abnormality: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    is_conditions_too_poor: { type: DataTypes.BOOLEAN, allowNull: false },
    reason: { type: DataTypes.STRING(1000), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable('diode_replacements', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    work_order_id: ref('work_orders'),
    string_id: ref('pv_strings'),
    module_position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    module_serial: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
    diode_position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    failure_mode: { type: DataTypes.STRING(20), allowNull: false },
    found_by: { type: DataTypes.STRING(20), allowNull: false },
    removed_part_json: { type: DataTypes.TEXT, allowNull: false },
    installed_part_json: { type: DataTypes.TEXT, allowNull: false },
    new_diode_forward_v: { type: DataTypes.DOUBLE, allowNull: true },
    voc_before_v: { type: DataTypes.DOUBLE, allowNull: true },
    voc_after_v: { type: DataTypes.DOUBLE, allowNull: true },
    before_photo_id: ref('photos', true, 'SET NULL'),
    after_photo_id: ref('photos', true, 'SET NULL'),
    notes: { type: DataTypes.TEXT, allowNull: false },
    technician_id: ref('users'),
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('diode_replacements', ['work_order_id'], { name: 'diode_replacements_ticket' });
  await qi.addIndex('diode_replacements', ['string_id'], { name: 'diode_replacements_string' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.dropTable('diode_replacements');
  await qi.dropTable('thermal_findings');
  await qi.dropTable('photos');
};
