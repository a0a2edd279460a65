import { describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { app } from './helpers.ts';

describe('GET /api/health', () => {
  it('reports the database as up with 200', async () => {
    const res = await supertest(app()).get('/api/health').expect(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up' });
  });
});
