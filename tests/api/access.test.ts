import { beforeAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { can, roles, type Action } from '@stringfield/shared';
import { app, demoEmail, resetDatabase, signIn, type Agent } from './helpers.ts';

// Generated from the one permission table: each route names the action it needs, and every role is
// expected to get 2xx when `can(role, action)` and 403 otherwise; signed-out callers get 401.
const routes: Array<{ method: 'get'; path: string; action: Action }> = [
  { method: 'get', path: '/api/users', action: 'users:manage' },
  { method: 'get', path: '/api/mail', action: 'mail:read' },
  { method: 'get', path: '/api/sites', action: 'assets:read' },
  { method: 'get', path: '/api/module-models', action: 'assets:read' },
  { method: 'get', path: '/api/inverter-models', action: 'assets:read' },
  { method: 'get', path: '/api/work-orders', action: 'workOrders:read' },
  { method: 'get', path: '/api/technicians', action: 'workOrders:read' },
  { method: 'get', path: '/api/instruments', action: 'workOrders:read' },
  { method: 'get', path: '/api/fleet/energy-at-risk', action: 'fleet:read' },
  { method: 'get', path: '/api/fleet/metrics?from=2026-01-01&to=2026-12-31', action: 'fleet:read' },
];

const agents = new Map<string, Agent>();
beforeAll(async () => {
  await resetDatabase();
  for (const role of roles) agents.set(role, await signIn(demoEmail[role]));
});

describe.each(routes)('$method $path needs $action', ({ method, path, action }) => {
  it.each(roles.map((role) => ({ role, allowed: can(role, action) })))(
    '$role → allowed: $allowed',
    async ({ role, allowed }) => {
      const res = await agents.get(role)![method](path);
      expect(res.status).toBe(allowed ? 200 : 403);
      if (!allowed) expect(res.body.error.code).toBe('FORBIDDEN');
    },
  );

  it('signed out → 401', async () => {
    const res = await supertest(app())[method](path);
    expect(res.status).toBe(401);
  });
});
