// npm run db:migrate | db:rollback: run migrations forward, or undo the last one (`down`, or `down --to 0`).
import { createMigrator } from '../lib/migrator.ts';
import { sequelize } from '../models/index.ts';

const [cmd = 'up', flag, value] = process.argv.slice(2);
const migrator = createMigrator(sequelize);
try {
  if (cmd === 'up') {
    const done = await migrator.up();
    process.stdout.write(`[stringfield] Migrations: ${done.length ? done.map((m) => m.name).join(', ') : 'up to date'}\n`);
  } else if (cmd === 'down') {
    const done = flag === '--to' ? await migrator.down({ to: value === '0' ? 0 : (value ?? 0) }) : await migrator.down();
    process.stdout.write(`[stringfield] Rolled back: ${done.map((m) => m.name).join(', ') || 'nothing'}\n`);
  } else {
    throw new Error(`Unknown command ${cmd}: use up or down`);
  }
} finally {
  await sequelize.close();
}
