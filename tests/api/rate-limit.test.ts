import { beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoEmail, errorOf, newAgent, resetDatabase } from './helpers.ts';

beforeEach(resetDatabase);

describe('sign-in rate limit (10 tries per 15 minutes per account and IP)', () => {
  it('answers the 11th failed try with 429, even with the right password, and leaves other accounts alone', async () => {
    const agent = await newAgent();
    for (let i = 0; i < 10; i += 1) {
      await agent
        .post('/api/auth/login')
        .set('x-csrf-token', agent.csrf)
        .send({ email: demoEmail.dispatcher, password: `wrong-${i}` })
        .expect(401);
    }
    const blocked = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: demoEmail.dispatcher, password: DEMO_PASSWORD })
      .expect(429);
    expect(errorOf(blocked).code).toBe('RATE_LIMITED');
    expect(errorOf(blocked).message).toMatch(/15 minutes/);

    await agent
      .post('/api/auth/login')
      .set('x-csrf-token', agent.csrf)
      .send({ email: demoEmail.supervisor, password: DEMO_PASSWORD })
      .expect(200);
  });

  it('does not count successful sign-ins against the limit', async () => {
    for (let i = 0; i < 12; i += 1) {
      const agent = await newAgent();
      await agent
        .post('/api/auth/login')
        .set('x-csrf-token', agent.csrf)
        .send({ email: demoEmail.admin, password: DEMO_PASSWORD })
        .expect(200);
    }
  });
});
