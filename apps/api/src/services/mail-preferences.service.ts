import { mailCategories, type mailPreferencesSchema } from '@stringfield/shared';
import type { z } from 'zod';
import { notFound } from '../lib/app-error.ts';
import { User } from '../models/index.ts';

type MailPreferences = z.infer<typeof mailPreferencesSchema>;

export async function getMailPreferences(userId: number): Promise<MailPreferences> {
  const user = await User.findByPk(userId, { attributes: ['id', 'mailOptOut'] });
  if (!user) throw notFound('That user');
  const optOut = user.mailOptOut.split(',').filter((c): c is MailPreferences['optOut'][number] =>
    (mailCategories as readonly string[]).includes(c),
  );
  return { optOut };
}

export async function setMailPreferences(userId: number, prefs: MailPreferences): Promise<MailPreferences> {
  await User.update({ mailOptOut: [...new Set(prefs.optOut)].join(',') }, { where: { id: userId } });
  return getMailPreferences(userId);
}
