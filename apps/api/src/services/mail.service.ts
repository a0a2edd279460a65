import fs from 'node:fs/promises';
import path from 'node:path';
import { mailMessageSchema, type MailMessage, type MailSummary, type Page, type PageQuery } from '@stringfield/shared';
import { env } from '../config/env.ts';
import { notFound } from '../lib/app-error.ts';

const idPattern = /^[0-9]{13}-[a-z0-9]{6,}$/;

async function readMessage(id: string): Promise<MailMessage | null> {
  try {
    const raw = await fs.readFile(path.join(env.MAIL_CATCHER_DIR, `${id}.json`), 'utf8');
    const parsed = mailMessageSchema.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

/** Messages held by the local mail catcher, newest first. */
export async function listMail(q: PageQuery): Promise<Page<MailSummary>> {
  let names: string[] = [];
  try {
    names = await fs.readdir(env.MAIL_CATCHER_DIR);
  } catch {
    names = [];
  }
  const ids = names
    .filter((n) => n.endsWith('.json'))
    .map((n) => n.slice(0, -5))
    .filter((id) => idPattern.test(id))
    .sort()
    .reverse();
  const slice = ids.slice((q.page - 1) * q.pageSize, q.page * q.pageSize);
  const messages = await Promise.all(slice.map(readMessage));
  const items = messages
    .filter((m): m is MailMessage => m !== null)
    .map(({ id, from, to, subject, receivedAt }) => ({ id, from, to, subject, receivedAt }));
  return { items, total: ids.length, page: q.page, pageSize: q.pageSize };
}

export async function getMail(id: string): Promise<MailMessage> {
  const message = idPattern.test(id) ? await readMessage(id) : null;
  if (!message) throw notFound('That message');
  return message;
}
