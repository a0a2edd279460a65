import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (table: string, allowNull = false, onDelete = 'RESTRICT') => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const archived = { is_archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false } };
const dbl = (allowNull = false) => ({ type: DataTypes.DOUBLE, allowNull });

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.createTable('sites', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    code: { type: DataTypes.STRING(8), allowNull: false, unique: true },
    address: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    time_zone: { type: DataTypes.STRING(64), allowNull: false },
    lowest_ambient_c: dbl(),
    highest_ambient_c: dbl(),
    design_irradiance_wm2: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1000 },
    owner_contact_email: { type: DataTypes.STRING(254), allowNull: false },
    ...archived,
    ...stamps,
  });
  await qi.createTable('site_owners', {
    site_id: { ...ref('sites', false, 'CASCADE'), primaryKey: true },
    user_id: { ...ref('users', false, 'CASCADE'), primaryKey: true },
  });
  await qi.addIndex('site_owners', ['user_id'], { name: 'site_owners_user' });

  await qi.createTable('module_models', {
    id,
    maker: { type: DataTypes.STRING(80), allowNull: false },
    model: { type: DataTypes.STRING(80), allowNull: false },
    cell_technology: { type: DataTypes.STRING(20), allowNull: false },
    pmax_w: dbl(),
    voc_v: dbl(),
    isc_a: dbl(),
    vmp_v: dbl(),
    imp_a: dbl(),
    alpha_isc_pct_per_c: dbl(),
    beta_voc_pct_per_c: dbl(),
    gamma_pmax_pct_per_c: dbl(),
    cells_in_series: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    bypass_diodes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    noct_c: dbl(true),
    ...archived,
    ...stamps,
  });
  await qi.addIndex('module_models', ['maker', 'model'], { unique: true, name: 'module_models_maker_model' });

  await qi.createTable('inverter_models', {
    id,
    maker: { type: DataTypes.STRING(80), allowNull: false },
    model: { type: DataTypes.STRING(80), allowNull: false },
    max_dc_v: dbl(),
    mppt_min_v: dbl(),
    mppt_max_v: dbl(),
    start_v: dbl(),
    mppt_inputs: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    max_input_a: dbl(),
    max_input_isc_a: dbl(),
    rated_ac_w: dbl(),
    max_dc_w: dbl(),
    ...archived,
    ...stamps,
  });
  await qi.addIndex('inverter_models', ['maker', 'model'], { unique: true, name: 'inverter_models_maker_model' });

  await qi.createTable('inverters', {
    id,
    site_id: ref('sites'),
    tag: { type: DataTypes.STRING(40), allowNull: false },
    inverter_model_id: ref('inverter_models'),
    serial: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
    ...archived,
    ...stamps,
  });
  await qi.addIndex('inverters', ['site_id', 'tag'], { unique: true, name: 'inverters_site_tag' });

  await qi.createTable('combiner_boxes', {
    id,
    site_id: ref('sites'),
    tag: { type: DataTypes.STRING(40), allowNull: false },
    fuse_rating_a: dbl(true),
    ...archived,
    ...stamps,
  });
  await qi.addIndex('combiner_boxes', ['site_id', 'tag'], { unique: true, name: 'combiner_boxes_site_tag' });

  await qi.createTable('pv_strings', {
    id,
    site_id: ref('sites'),
    inverter_id: ref('inverters'),
    mppt_input: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    combiner_box_id: ref('combiner_boxes', true),
    combiner_position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    label: { type: DataTypes.STRING(40), allowNull: false },
    module_model_id: ref('module_models'),
    modules_in_series: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    strings_in_parallel: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    commissioned_on: { type: DataTypes.DATEONLY, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false },
    ...archived,
    ...stamps,
  });
  await qi.addIndex('pv_strings', ['site_id', 'label'], { unique: true, name: 'pv_strings_site_label' });
  await qi.addIndex('pv_strings', ['site_id', 'inverter_id', 'mppt_input'], { name: 'pv_strings_site_input' });
  await qi.addIndex('pv_strings', ['inverter_id', 'mppt_input'], { name: 'pv_strings_input' });
  await qi.addIndex('pv_strings', ['module_model_id'], { name: 'pv_strings_module_model' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  for (const t of ['pv_strings', 'combiner_boxes', 'inverters', 'inverter_models', 'module_models', 'site_owners', 'sites']) {
    await qi.dropTable(t);
  }
};
