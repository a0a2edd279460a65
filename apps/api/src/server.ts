import { createApp } from './app.ts';
import { env } from './config/env.ts';
import { logger } from './lib/logger.ts';
import { closeMailer, mailIdle, startMailSweep } from './lib/mailer.ts';
import { startOverdueSweep } from './services/overdue-sweep.service.ts';
import { sequelize } from './models/index.ts';

const app = createApp();
const server = app.listen(env.PORT, env.HOST, () => {
  logger.info(`Stringfield is serving on ${env.APP_URL}`);
});
server.on('error', (err) => {
  logger.fatal({ err }, `could not listen on ${env.HOST}:${env.PORT}`);
  process.exit(1);
});
const stopSweep = startMailSweep();
const stopOverdue = startOverdueSweep();

let closing = false;
function shutdown(signal: string) {
  if (closing) return;
  closing = true;
  logger.info({ signal }, 'shutting down');
  stopSweep();
  stopOverdue();
  server.close(() => {
    void mailIdle().finally(() => {
      closeMailer();
      void sequelize.close().finally(() => process.exit(0));
    });
  });
  setTimeout(() => process.exit(1), 10_000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
