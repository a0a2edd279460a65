import { beforeEach, describe, expect, it } from 'vitest';
import { PasswordToken } from '../../apps/api/src/models/index.ts';
import { DEMO_PASSWORD, demoEmail, errorOf, newAgent, resetDatabase, signIn, tokenFromLink, waitForMail } from './helpers.ts';

beforeEach(resetDatabase);

async function requestReset(email: string) {
  const agent = await newAgent();
  const since = Date.now() - 5;
  const res = await agent.post('/api/auth/reset-request').set('x-csrf-token', agent.csrf).send({ email }).expect(202);
  return { agent, res, since };
}

describe('password reset by e-mailed one-time link', () => {
  it('mails a link; the link sets a new password once, ends old sessions, and the old password stops working', async () => {
    const oldSession = await signIn(demoEmail.technician);
    const { agent, since } = await requestReset(demoEmail.technician);
    const mail = await waitForMail(demoEmail.technician, /Reset your Stringfield password/, since);
    expect(mail.html).toContain('/reset-password?token=');
    const token = tokenFromLink(mail.text);

    const newPassword = 'field-day-voc-512';
    await agent.post('/api/auth/reset').set('x-csrf-token', agent.csrf).send({ token, password: newPassword }).expect(200);
    await oldSession.get('/api/auth/me').expect(401);

    const reused = await agent.post('/api/auth/reset').set('x-csrf-token', agent.csrf).send({ token, password: 'another-long-password' }).expect(400);
    expect(errorOf(reused).message).toMatch(/already been used/);

    const login = await newAgent();
    await login.post('/api/auth/login').set('x-csrf-token', login.csrf).send({ email: demoEmail.technician, password: DEMO_PASSWORD }).expect(401);
    await login.post('/api/auth/login').set('x-csrf-token', login.csrf).send({ email: demoEmail.technician, password: newPassword }).expect(200);
  });

  it('refuses an expired link and says how long links last', async () => {
    const { agent, since } = await requestReset(demoEmail.supervisor);
    const token = tokenFromLink((await waitForMail(demoEmail.supervisor, /Reset/, since)).text);
    await PasswordToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { purpose: 'reset' } });
    const res = await agent.post('/api/auth/reset').set('x-csrf-token', agent.csrf).send({ token, password: 'a-brand-new-password' }).expect(400);
    expect(errorOf(res).message).toMatch(/expired .*1 hour/);
  });

  it('answers an unknown address exactly like a known one and sends nothing', async () => {
    const known = await requestReset(demoEmail.owner);
    const unknown = await requestReset('nobody-here@stringfield.test');
    expect(unknown.res.body).toEqual(known.res.body);
    expect(await PasswordToken.count()).toBe(1);
  });

  it('refuses a short new password with a field message', async () => {
    const { agent, since } = await requestReset(demoEmail.admin);
    const token = tokenFromLink((await waitForMail(demoEmail.admin, /Reset/, since)).text);
    const res = await agent.post('/api/auth/reset').set('x-csrf-token', agent.csrf).send({ token, password: 'short' }).expect(400);
    expect(errorOf(res).fields?.password).toMatch(/at least 12/);
  });
});
