import { DataTypes } from 'sequelize';
import type { MigrationFn } from 'umzug';
import type { MigrationContext } from '../src/lib/migrator.ts';
import { REPEAT_BACKFILL_SQL } from '../src/lib/repeat-faults.ts';

// A ticket's string is a repeat fault when the same string had a ticket signed off in the 90 days
// before this one was reported. That is settled the moment the ticket is created, so it is stored
// then (and back-filled here) instead of being searched for by every metrics request.
export const up: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.addColumn('work_order_strings', 'repeat_of_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.addIndex('work_order_strings', ['repeat_of_id'], { name: 'work_order_strings_repeat' });
  await qi.sequelize.query(REPEAT_BACKFILL_SQL);
};

export const down: MigrationFn<MigrationContext> = async ({ context: qi }) => {
  await qi.removeIndex('work_order_strings', 'work_order_strings_repeat');
  await qi.removeColumn('work_order_strings', 'repeat_of_id');
};
