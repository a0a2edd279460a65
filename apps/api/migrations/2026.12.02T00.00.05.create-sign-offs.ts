import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.addColumn('work_orders', 'pending_offline_count', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  await qi.createTable('sign_offs', {
    work_order_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'work_orders', key: 'id' },
      onDelete: 'RESTRICT',
    },
    supervisor_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    signed_at: { type: DataTypes.DATE(3), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false },
    overrides_json: { type: DataTypes.TEXT, allowNull: false },
    // SHA-256 of the canonical JSON snapshot of the ticket's evidence at the moment of sign-off.
    digest: { type: DataTypes.CHAR(64), allowNull: false },
    snapshot_json: { type: DataTypes.TEXT('medium'), allowNull: false },
    last_event_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.dropTable('sign_offs');
  await qi.removeColumn('work_orders', 'pending_offline_count');
};
