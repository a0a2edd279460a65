import type { Transaction } from 'sequelize';
import { logger } from './logger.ts';

/**
 * Work to undo outside the database when a transaction rolls back: files written for rows that the rollback
 * removes. Sequelize has commit hooks only, so the code that owns the transaction runs these when it fails.
 */
const hooks = new WeakMap<Transaction, Array<() => Promise<void>>>();

export function onRollback(transaction: Transaction, undo: () => Promise<void>): void {
  const list = hooks.get(transaction) ?? [];
  list.push(undo);
  hooks.set(transaction, list);
}

/** Runs (once) what was registered for `transaction`; a failing step is logged and the rest still run. */
export async function runRollbackHooks(transaction: Transaction): Promise<void> {
  const list = hooks.get(transaction) ?? [];
  hooks.delete(transaction);
  for (const undo of list.reverse()) {
    await undo().catch((err: unknown) => logger.error({ err }, 'undoing work after a rollback failed'));
  }
}
