import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

const statuses = ['reported', 'dispatched', 'in_field', 'awaiting_signoff', 'returned', 'signed_off', 'cancelled'];
const ref = (table: string, allowNull = false, onDelete = 'RESTRICT') => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.addColumn('users', 'mail_opt_out', { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' });

  await qi.createTable('site_sla_hours', {
    site_id: { ...ref('sites', false, 'CASCADE'), primaryKey: true },
    priority: { type: DataTypes.ENUM('P1', 'P2', 'P3', 'P4'), primaryKey: true },
    hours: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  });

  await qi.createTable('work_order_counters', {
    year: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
    last_number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  });

  await qi.createTable('work_orders', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
    site_id: ref('sites'),
    fault_category: { type: DataTypes.STRING(32), allowNull: false },
    priority: { type: DataTypes.ENUM('P1', 'P2', 'P3', 'P4'), allowNull: false },
    title: { type: DataTypes.STRING(160), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    source: { type: DataTypes.STRING(32), allowNull: false },
    status: { type: DataTypes.ENUM(...statuses), allowNull: false },
    reported_at: { type: DataTypes.DATE, allowNull: false },
    due_at: { type: DataTypes.DATE, allowNull: false },
    assignee_id: ref('users', true, 'SET NULL'),
    created_by_id: ref('users'),
    return_reason: { type: DataTypes.TEXT, allowNull: true },
    cancel_reason: { type: DataTypes.TEXT, allowNull: true },
    dispatched_at: { type: DataTypes.DATE, allowNull: true },
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    signed_off_at: { type: DataTypes.DATE, allowNull: true },
    return_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    overdue_notified_at: { type: DataTypes.DATE, allowNull: true },
    overdue_claim: { type: DataTypes.STRING(64), allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('work_orders', ['status', 'due_at'], { name: 'work_orders_status_due' });
  await qi.addIndex('work_orders', ['site_id', 'status', 'due_at'], { name: 'work_orders_site_status_due' });
  await qi.addIndex('work_orders', ['assignee_id', 'status', 'due_at'], { name: 'work_orders_assignee_status_due' });
  await qi.addIndex('work_orders', ['priority', 'due_at'], { name: 'work_orders_priority_due' });
  await qi.addIndex('work_orders', ['reported_at'], { name: 'work_orders_reported' });
  await qi.addIndex('work_orders', ['fault_category', 'status'], { name: 'work_orders_category_status' });

  await qi.createTable('work_order_strings', {
    work_order_id: { ...ref('work_orders', false, 'CASCADE'), primaryKey: true },
    string_id: { ...ref('pv_strings'), primaryKey: true },
    symptom: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
  });
  await qi.addIndex('work_order_strings', ['string_id'], { name: 'work_order_strings_string' });

  await qi.createTable('work_order_events', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    work_order_id: ref('work_orders', false, 'CASCADE'),
    actor_id: ref('users', true, 'SET NULL'),
    type: { type: DataTypes.ENUM('created', 'transition', 'assigned', 'updated', 'comment'), allowNull: false },
    from_status: { type: DataTypes.ENUM(...statuses), allowNull: true },
    to_status: { type: DataTypes.ENUM(...statuses), allowNull: true },
    changes: { type: DataTypes.TEXT, allowNull: true },
    comment: { type: DataTypes.TEXT, allowNull: true },
    // Millisecond precision keeps the timeline in order when two things happen within a second.
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('work_order_events', ['work_order_id', 'id'], { name: 'work_order_events_ticket' });

  await qi.createTable('comments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    work_order_id: ref('work_orders', false, 'CASCADE'),
    author_id: ref('users'),
    body: { type: DataTypes.TEXT, allowNull: false },
    mentions: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('comments', ['work_order_id', 'id'], { name: 'comments_ticket' });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  for (const t of ['comments', 'work_order_events', 'work_order_strings', 'work_orders', 'work_order_counters', 'site_sla_hours']) {
    await qi.dropTable(t);
  }
  await qi.removeColumn('users', 'mail_opt_out');
};
