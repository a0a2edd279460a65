import { Op, type Transaction } from 'sequelize';
import { runRollbackHooks } from '../src/lib/rollback-hooks.ts';
import { hashPassword } from '../src/lib/passwords.ts';
import { User, sequelize } from '../src/models/index.ts';
import { DEMO_PASSWORD, demoUsers } from './demo-users.ts';
import { seedDemoPlant } from './demo-plant.ts';
import { seedDemoWorkOrders } from './demo-work-orders.ts';

export type SeedResult = { status: 'seeded' | 'skipped'; reason?: string; users: number; sites?: number; strings?: number; workOrders?: number };

/**
 * Idempotent demo seed. It refuses to touch a database that holds accounts that are not demo
 * accounts, unless `force` is given.
 */
export async function seedDemo({ force = false, plant = true } = {}): Promise<SeedResult> {
  const foreign = await User.count({ where: { isDemo: false } });
  if (foreign > 0 && !force) {
    return { status: 'skipped', reason: `the database holds ${foreign} non-demo account(s)`, users: 0 };
  }
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  let seeding: Transaction | undefined;
  const created = await sequelize.transaction(async (transaction) => {
    seeding = transaction;
    const existing = await User.findAll({ where: { email: { [Op.in]: demoUsers.map((u) => u.email) } }, transaction });
    const byEmail = new Map(existing.map((u) => [u.email, u]));
    for (const u of demoUsers) {
      const row = byEmail.get(u.email);
      if (row) await row.update({ name: u.name, role: u.role, isActive: true, isDemo: true }, { transaction });
      else await User.create({ ...u, passwordHash, isDemo: true, lastSignInAt: null }, { transaction });
    }
    if (!plant) return { sites: 0, strings: 0, workOrders: 0 };
    const layout = await seedDemoPlant(transaction);
    return { ...layout, workOrders: await seedDemoWorkOrders(transaction) };
  }).catch(async (err: unknown) => {
    // The photos' files were written as the rows were; the rows are gone now, so are the files.
    if (seeding) await runRollbackHooks(seeding);
    throw err;
  });
  return { status: 'seeded', users: demoUsers.length, ...created };
}
