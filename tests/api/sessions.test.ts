import { beforeEach, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { createApp } from '../../apps/api/src/app.ts';
import { demoEmail, newAgent, resetDatabase, signIn } from './helpers.ts';

beforeEach(resetDatabase);

describe('sessions shared through MariaDB', () => {
  it('keeps a user signed in on a second API instance that shares the store', async () => {
    const first = createApp({ webDist: null });
    const second = createApp({ webDist: null });
    const agent = await signIn(demoEmail.technician, undefined, first);
    const me = await agent.get('/api/auth/me').expect(200);
    const cookie = ([] as string[])
      .concat(me.headers['set-cookie'] ?? [])
      .map((c) => c.split(';')[0])
      .find((c) => c?.startsWith('sf.sid='));
    expect(cookie).toBeDefined();
    const other = await supertest(second).get('/api/auth/me').set('Cookie', cookie!).expect(200);
    expect(other.body.user.email).toBe(demoEmail.technician);
  });
});

describe('sign out everywhere', () => {
  it('ends every session of the caller, on every device, and no one else’s', async () => {
    const phone = await signIn(demoEmail.technician);
    const laptop = await signIn(demoEmail.technician);
    const colleague = await signIn(demoEmail.dispatcher);
    await phone.get('/api/auth/me').expect(200);
    await laptop.get('/api/auth/me').expect(200);

    const res = await laptop.post('/api/auth/sign-out-everywhere').set('x-csrf-token', laptop.csrf).expect(200);
    expect(res.body.ended).toBe(2);
    await phone.get('/api/auth/me').expect(401);
    await laptop.get('/api/auth/me').expect(401);
    await colleague.get('/api/auth/me').expect(200);
  });

  it('needs a signed-in caller', async () => {
    const anonymous = await newAgent();
    await anonymous.post('/api/auth/sign-out-everywhere').set('x-csrf-token', anonymous.csrf).expect(401);
  });
});
