import { beforeEach, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { createApp } from '../../apps/api/src/app.ts';
import { demoEmail, resetDatabase, signIn } from './helpers.ts';

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
