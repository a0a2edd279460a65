import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT('medium'), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sessions', ['expires'], { name: 'sessions_expires' });
  await qi.addIndex('sessions', ['user_id'], { name: 'sessions_user' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.dropTable('sessions');
};
