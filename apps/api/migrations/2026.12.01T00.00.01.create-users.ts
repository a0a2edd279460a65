import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'dispatcher', 'technician', 'supervisor', 'owner'), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: true },
    is_active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('users', ['role', 'is_active'], { name: 'users_role_active' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.dropTable('users');
};
