import { randomUUID } from 'node:crypto';
import { Op } from 'sequelize';
import { openStatuses } from '@stringfield/shared';
import { logger } from '../lib/logger.ts';
import { queueMail } from '../lib/mailer.ts';
import { overdueMail } from '../lib/mail-templates.ts';
import { Site, User, WorkOrder, sequelize } from '../models/index.ts';

/**
 * Tell the dispatchers once about each ticket that has passed its due time. Each run claims its tickets
 * with one UPDATE (overdue_notified_at + a claim token), so several API processes never send twice.
 */
export async function sweepOverdue(limit = 200): Promise<number> {
  const claim = randomUUID();
  const [claimed] = await WorkOrder.update(
    { overdueNotifiedAt: new Date(), overdueClaim: claim },
    { where: { status: { [Op.in]: [...openStatuses] }, dueAt: { [Op.lt]: new Date() }, overdueNotifiedAt: null }, limit },
  );
  if (claimed === 0) return 0;
  const tickets = await WorkOrder.findAll({ where: { overdueClaim: claim }, include: [{ model: Site, as: 'site' }] });
  const dispatchers = (await User.findAll({ where: { role: 'dispatcher', isActive: true } })).filter(
    (u) => !u.mailOptOut.split(',').includes('overdue'),
  );
  await sequelize.transaction(async (transaction) => {
    for (const t of tickets) {
      for (const d of dispatchers) {
        await queueMail(
          overdueMail(d.email, d.name, { id: t.id, number: t.number, title: t.title, siteName: t.site!.name, dueAt: t.dueAt, priority: t.priority }),
          transaction,
        );
      }
    }
  });
  return tickets.length;
}

export function startOverdueSweep(intervalMs = 60_000): () => void {
  const timer = setInterval(() => {
    sweepOverdue().catch((err: unknown) => logger.warn({ err }, 'overdue sweep failed'));
  }, intervalMs);
  timer.unref();
  return () => clearInterval(timer);
}
