import express from 'express';
import supertest from 'supertest';
import { DatabaseError } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { errorHandler } from '../../apps/api/src/middleware/error-handler.ts';

// Two writes that meet on the same rows (a revision and a hand-in, say) can make MariaDB end one of them:
// a deadlock (1213) or a lock held too long (1205). Nothing of it was saved, so the person is told to send
// it again — not "something went wrong". The errors are as the mariadb driver raises them, through the
// app's own error handler.
const failingWith = (errno: number, code: string, message: string) => {
  const app = express();
  app.get('/write', () => {
    throw new DatabaseError(Object.assign(new Error(message), { errno, code, sql: 'UPDATE work_orders SET …' }));
  });
  app.use(errorHandler);
  return app;
};

describe('a write ended by the database because of another write', () => {
  it.each([
    [1213, 'ER_LOCK_DEADLOCK', 'Deadlock found when trying to get lock; try restarting transaction'],
    [1205, 'ER_LOCK_WAIT_TIMEOUT', 'Lock wait timeout exceeded; try restarting transaction'],
  ])('answers %i (%s) with 409 and "send it again"', async (errno, code, message) => {
    const res = await supertest(failingWith(errno, code, message)).get('/write').expect(409);
    expect(res.body.error.code).toBe('CONFLICT');
    expect(res.body.error.message).toMatch(/nothing was saved\. Send it again/);
  });

  it('still answers other database errors with 500', async () => {
    const res = await supertest(failingWith(1064, 'ER_PARSE_ERROR', 'You have an error in your SQL syntax')).get('/write').expect(500);
    expect(res.body.error.code).toBe('INTERNAL');
  });
});
