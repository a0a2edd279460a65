import { beforeEach, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { User } from '../../apps/api/src/models/index.ts';
import { DEMO_PASSWORD, app, demoEmail, errorOf, newAgent, refreshCsrf, resetDatabase, signIn } from './helpers.ts';

beforeEach(resetDatabase);

describe('sign-in', () => {
  it('signs a demo technician in and answers /me with their role', async () => {
    const agent = await signIn(demoEmail.technician);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email: demoEmail.technician, role: 'technician', name: 'Demo Technician' });
    expect(me.body.user).not.toHaveProperty('passwordHash');
  });

  it('sets an httpOnly, SameSite=Lax session cookie and a new session id at sign-in', async () => {
    const agent = await newAgent();
    const before = await agent.get('/api/auth/csrf');
    const res = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: demoEmail.admin, password: DEMO_PASSWORD })
      .expect(200);
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('sf.sid='));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const sidOf = (c: string) => c.split(';')[0];
    const beforeCookie = ([] as string[]).concat(before.headers['set-cookie'] ?? []).find((c) => c.startsWith('sf.sid='));
    // The pre-login session (created for the CSRF token) must not survive as the signed-in session.
    expect(sidOf(cookie!)).not.toBe(beforeCookie ? sidOf(beforeCookie) : undefined);
  });

  it('answers a wrong password and an unknown e-mail with the same 401 message', async () => {
    const agent = await newAgent();
    const wrong = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: demoEmail.admin, password: 'not-the-password' })
      .expect(401);
    const unknown = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: 'nobody@stringfield.test', password: 'whatever-it-is' })
      .expect(401);
    expect(errorOf(wrong).code).toBe('UNAUTHENTICATED');
    expect(errorOf(wrong).message).toBe(errorOf(unknown).message);
    expect(errorOf(wrong).message).toMatch(/do not match/);
  });

  it('refuses a deactivated account with 403 and says to ask the administrator', async () => {
    await User.update({ isActive: false }, { where: { email: demoEmail.dispatcher } });
    const agent = await newAgent();
    const res = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: demoEmail.dispatcher, password: DEMO_PASSWORD })
      .expect(403);
    expect(errorOf(res).message).toMatch(/deactivated/);
  });

  it('names the field when the e-mail is not an e-mail address', async () => {
    const agent = await newAgent();
    const res = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: 'not-an-address', password: 'x' })
      .expect(400);
    expect(errorOf(res).code).toBe('VALIDATION_FAILED');
    expect(errorOf(res).fields?.email).toMatch(/valid e-mail/);
  });

  it('answers malformed JSON with 400 and an oversize body with 413', async () => {
    const agent = await newAgent();
    const bad = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .set('content-type', 'application/json')
      .send('{"email": "admin@stringfield.test", ')
      .expect(400);
    expect(errorOf(bad).message).toMatch(/not valid JSON/);
    const big = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: demoEmail.admin, password: 'x'.repeat(200_000) })
      .expect(413);
    expect(errorOf(big).code).toBe('PAYLOAD_TOO_LARGE');
  });

  it('refuses a state-changing request without the CSRF token', async () => {
    const res = await supertest(app()).post('/api/auth/login').send({ email: demoEmail.admin, password: DEMO_PASSWORD }).expect(403);
    expect(errorOf(res).code).toBe('CSRF_FAILED');
    const agent = await newAgent();
    const wrongToken = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', 'forged-token')
      .send({ email: demoEmail.admin, password: DEMO_PASSWORD })
      .expect(403);
    expect(errorOf(wrongToken).code).toBe('CSRF_FAILED');
  });

  it('signs out: the session ends and /me answers 401', async () => {
    const agent = await signIn(demoEmail.supervisor);
    await agent.post('/api/auth/logout').set('x-csrf-token', agent.csrf).expect(204);
    const me = await agent.get('/api/auth/me').expect(401);
    expect(errorOf(me).code).toBe('UNAUTHENTICATED');
  });

  it('ends a deactivated user’s live session on their next request', async () => {
    const agent = await signIn(demoEmail.owner);
    await agent.get('/api/auth/me').expect(200);
    await User.update({ isActive: false }, { where: { email: demoEmail.owner } });
    await agent.get('/api/auth/me').expect(401);
  });

  it('answers unknown API routes with a JSON 404', async () => {
    const agent = await signIn(demoEmail.admin);
    await refreshCsrf(agent);
    const res = await agent.get('/api/no-such-thing').expect(404);
    expect(errorOf(res).code).toBe('NOT_FOUND');
  });
});
