import { randomUUID } from 'node:crypto';
import nodemailer from 'nodemailer';
import { Op, type Transaction } from 'sequelize';
import { env } from '../config/env.ts';
import { MailOutbox } from '../models/index.ts';
import { logger } from './logger.ts';

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

function transportOptions(url: string) {
  const u = new URL(url);
  return {
    host: u.hostname,
    port: Number(u.port || (u.protocol === 'smtps:' ? 465 : 25)),
    secure: u.protocol === 'smtps:',
    auth: u.username ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } : undefined,
    connectionTimeout: 3000,
    greetingTimeout: 3000,
    socketTimeout: 10000,
  };
}

const transport = nodemailer.createTransport(transportOptions(env.SMTP_URL));
const workerId = `${process.pid}-${randomUUID().slice(0, 8)}`;
const maxAttempts = 10;

/**
 * Write a message to the outbox (inside the caller's transaction when given) and try to deliver it
 * right after. A mail server that is down never fails the caller: the sweep retries with back-off.
 */
export async function queueMail(mail: OutgoingMail, transaction?: Transaction): Promise<void> {
  await MailOutbox.create(
    { toAddress: mail.to, subject: mail.subject, textBody: mail.text, htmlBody: mail.html ?? null, lastError: null, claimedBy: null, claimedUntil: null, sentAt: null },
    { transaction },
  );
  const kick = () => void track(deliverDueMail()).catch((err: unknown) => logger.warn({ err }, 'mail delivery failed'));
  if (transaction) transaction.afterCommit(kick);
  else kick();
}

const inFlight = new Set<Promise<unknown>>();
function track<T>(p: Promise<T>): Promise<T> {
  inFlight.add(p);
  void p.finally(() => inFlight.delete(p)).catch(() => undefined);
  return p;
}

/** Resolves once no delivery started by this process is still running (used by tests and shutdown). */
export async function mailIdle(): Promise<void> {
  while (inFlight.size > 0) await Promise.allSettled([...inFlight]);
}

/**
 * Claim due messages in the database (safe with several API processes: each claims its own rows),
 * send them, and record the outcome. Returns how many were sent.
 */
export async function deliverDueMail(limit = 20): Promise<number> {
  const now = new Date();
  const [claimed] = await MailOutbox.update(
    { claimedBy: workerId, claimedUntil: new Date(now.getTime() + 60_000) },
    {
      where: {
        status: 'pending',
        nextAttemptAt: { [Op.lte]: now },
        [Op.or]: [{ claimedUntil: null }, { claimedUntil: { [Op.lt]: now } }],
      },
      limit,
    },
  );
  if (claimed === 0) return 0;
  const rows = await MailOutbox.findAll({ where: { claimedBy: workerId, status: 'pending' }, order: [['id', 'ASC']] });
  let sent = 0;
  for (const row of rows) {
    try {
      await transport.sendMail({
        from: env.MAIL_FROM,
        to: row.toAddress,
        subject: row.subject,
        text: row.textBody,
        html: row.htmlBody ?? undefined,
      });
      await row.update({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, claimedBy: null, claimedUntil: null, lastError: null });
      sent += 1;
    } catch (err) {
      const attempts = row.attempts + 1;
      const backoffMs = Math.min(2 ** attempts * 15_000, 3_600_000);
      await row.update({
        attempts,
        status: attempts >= maxAttempts ? 'failed' : 'pending',
        lastError: String((err as Error).message ?? err).slice(0, 1000),
        nextAttemptAt: new Date(Date.now() + backoffMs),
        claimedBy: null,
        claimedUntil: null,
      });
      logger.warn({ to: row.toAddress, attempts, err: (err as Error).message }, 'mail not delivered; will retry');
    }
  }
  return sent;
}

/** Retry queued mail every `intervalMs`; returns a function that stops the sweep. */
export function startMailSweep(intervalMs = 30_000): () => void {
  const timer = setInterval(() => {
    track(deliverDueMail()).catch((err: unknown) => logger.warn({ err }, 'mail sweep failed'));
  }, intervalMs);
  timer.unref();
  return () => clearInterval(timer);
}

export function closeMailer(): void {
  transport.close();
}
