import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.createTable('rate_limit_hits', {
    key: { type: DataTypes.STRING(255), primaryKey: true },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    reset_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('mail_outbox', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(255), allowNull: false },
    text_body: { type: DataTypes.TEXT, allowNull: false },
    html_body: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    next_attempt_at: { type: DataTypes.DATE, allowNull: false },
    claimed_by: { type: DataTypes.STRING(64), allowNull: true },
    claimed_until: { type: DataTypes.DATE, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('mail_outbox', ['status', 'next_attempt_at'], { name: 'mail_outbox_due' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.dropTable('mail_outbox');
  await qi.dropTable('rate_limit_hits');
};
