import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';

// Covering indexes for the fleet metrics, measured with the scale data set (100,000 tickets):
// open tickets by state and age, mean times per site and category, first-time fix.
const indexes: Array<[string, string[]]> = [
  ['work_orders_status_reported_due', ['status', 'reported_at', 'due_at']],
  ['work_orders_reported_cover', ['reported_at', 'site_id', 'fault_category', 'dispatched_at', 'submitted_at', 'signed_off_at']],
  ['work_orders_status_signed_returns', ['status', 'signed_off_at', 'return_count']],
];

export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  for (const [name, fields] of indexes) await qi.addIndex('work_orders', fields, { name });
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  for (const [name] of indexes) await qi.removeIndex('work_orders', name);
};
