// npm run db:seed [-- --force]: the demo crew (and, as features land, the demo plant). Idempotent.
import { seedDemo } from '../../seeders/demo.ts';
import { sequelize } from '../models/index.ts';

const force = process.argv.includes('--force');
try {
  const result = await seedDemo({ force });
  if (result.status === 'seeded') process.stdout.write(
      `[stringfield] Demo data in place (${result.users} demo users; ${result.sites ?? 0} new sites with ${result.strings ?? 0} strings; ${result.workOrders ?? 0} new work orders).\n`,
    );
  else process.stdout.write(`[stringfield] Demo seed skipped: ${result.reason}. Use npm run db:seed -- --force to seed anyway.\n`);
} finally {
  await sequelize.close();
}
