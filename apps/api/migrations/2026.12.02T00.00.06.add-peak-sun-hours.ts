import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  // Assumed peak sun hours per day, for the rough daily energy-at-risk estimate (editable per site).
  await qi.addColumn('sites', 'peak_sun_hours', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 4.5 });
  await qi.addIndex('work_orders', ['signed_off_at'], { name: 'work_orders_signed_off' });
  await qi.addIndex('work_order_strings', ['string_id', 'work_order_id'], { name: 'work_order_strings_string_ticket' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.removeIndex('work_order_strings', 'work_order_strings_string_ticket');
  await qi.removeIndex('work_orders', 'work_orders_signed_off');
  await qi.removeColumn('sites', 'peak_sun_hours');
};
