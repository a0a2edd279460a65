import fs from 'node:fs/promises';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readCaughtMail, startMailCatcher } from '../../scripts/mail-catcher.ts';

// The mailer reads SMTP_URL once, when it is first imported: point it at a loopback port where nothing
// listens (the mail server is down) before anything of the API is loaded.
async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}
const smtpPort = await freePort();
process.env.SMTP_URL = `smtp://127.0.0.1:${smtpPort}`;
// The failed first delivery logs a warning by design; keep the test's output to real problems.
process.env.LOG_LEVEL = 'error';
const { demoEmail, resetDatabase, signIn } = await import('./helpers.ts');
const { deliverDueMail, mailIdle, startMailSweep } = await import('../../apps/api/src/lib/mailer.ts');
const { MailOutbox, User, sequelize } = await import('../../apps/api/src/models/index.ts');

const invitee = 'ilse.varga@stringfield.test';
let catcherDir = '';

beforeAll(async () => {
  await resetDatabase();
  catcherDir = await fs.mkdtemp(path.join(os.tmpdir(), 'stringfield-mail-outage-'));
});

afterAll(async () => {
  await mailIdle();
  await fs.rm(catcherDir, { recursive: true, force: true });
});

const outboxRow = async () => (await MailOutbox.findAll({ where: { toAddress: invitee } }))[0];

describe('when the mail server is down', () => {
  it('still invites the user, keeps the invitation in the outbox, and the retry sweep sends it once the server is back', async () => {
    const admin = await signIn(demoEmail.admin);
    const created = await admin
      .post('/api/users')
      .set('x-csrf-token', admin.csrf)
      .send({ email: invitee, name: 'Ilse Varga', role: 'technician' })
      .expect(201);
    expect(created.body).toMatchObject({ email: invitee, role: 'technician' });
    expect(await User.count({ where: { email: invitee } })).toBe(1);

    // The delivery right after the commit failed: the message waits with a back-off.
    await mailIdle();
    expect(await MailOutbox.count({ where: { toAddress: invitee } })).toBe(1);
    const queued = (await outboxRow())!;
    expect(queued.subject).toMatch(/invited/);
    expect(queued).toMatchObject({ status: 'pending', attempts: 1, sentAt: null, claimedBy: null });
    expect(queued.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(queued.nextAttemptAt.getTime()).toBeGreaterThan(Date.now() + 10_000);

    const catcher = await startMailCatcher({ port: smtpPort, dir: catcherDir });
    const stopSweep = startMailSweep(50);
    try {
      // The server is back, but the back-off has not run out: the sweep leaves the message alone.
      expect(await deliverDueMail()).toBe(0);
      await new Promise((r) => setTimeout(r, 300));
      expect(await readCaughtMail(catcherDir)).toHaveLength(0);
      expect((await outboxRow())!.status).toBe('pending');

      // The back-off (30 s after a first failure) runs out.
      await sequelize.query('UPDATE mail_outbox SET next_attempt_at = ? WHERE id = ?', {
        replacements: [new Date(Date.now() - 1000), queued.id],
      });
      const deadline = Date.now() + 10_000;
      while ((await outboxRow())!.status !== 'sent') {
        if (Date.now() > deadline)
          throw new Error('the sweep did not send the queued invitation within 10 s');
        await new Promise((r) => setTimeout(r, 50));
      }
      // Let the sweep keep running for a while: a sent message is not sent again.
      await new Promise((r) => setTimeout(r, 500));
      expect(await deliverDueMail()).toBe(0);
    } finally {
      stopSweep();
      await mailIdle();
      await catcher.close();
    }

    const caught = (await readCaughtMail(catcherDir)).filter((m) => m.to.includes(invitee));
    expect(caught).toHaveLength(1);
    expect(caught[0]!.subject).toBe(queued.subject);
    expect(caught[0]!.text).toContain('token=');
    const sent = (await outboxRow())!;
    expect(sent).toMatchObject({ status: 'sent', attempts: 2, lastError: null, claimedBy: null });
    expect(sent.sentAt).not.toBeNull();
  }, 30_000);
});
