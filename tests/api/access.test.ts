import { beforeAll, describe, expect, it } from 'vitest';
import { can, roles, type Role } from '@stringfield/shared';
import { routeTable, type RouteEntry } from '../../apps/api/src/lib/route-table.ts';
import {
  CombinerBox,
  Inverter,
  InverterModel,
  ModuleModel,
  PvString,
  Site,
  User,
  WorkOrder,
} from '../../apps/api/src/models/index.ts';
import { app, demoEmail, newAgent, resetDatabase, signIn, type Agent } from './helpers.ts';

// The access matrix, generated from the routes themselves: `routeTable` reads every route the app
// serves with the guard it was written with (`requirePermission(action)` from the one permission table,
// `requireAuth`, or `publicRoute`). A route added without a guard fails the first test; a guard changed in
// a route or in the table changes the expectations below with it.
//
// Expected status per caller:
// - signed out: 401 on every guarded route;
// - a role the guard refuses: 403 FORBIDDEN, before any lookup or validation;
// - a role the guard admits: reads of demo records 200 (404 where the record does not exist), writes
//   4xx from validation or lookup (400 / 404 / 409: the request is empty or names a missing record, so
//   nothing is written), never 401, 403 or 5xx;
// - an owner of another site: 404 on every read of a Fair Wind Meadow record the owner role is admitted to.

const routes = routeTable(app()).filter((r) => r.path.startsWith('/api/'));
const missing = 999_999;
const ids: Record<string, number | string> = {};

type Caller = Role | 'otherOwner';
const agents = new Map<Caller, Agent>();

beforeAll(async () => {
  await resetDatabase({ plant: true });
  const fwm = (await Site.findOne({ where: { code: 'FWM' } }))!;
  const string = (await PvString.findOne({ where: { siteId: fwm.id }, order: [['id', 'ASC']] }))!;
  const ticket = (await WorkOrder.findOne({
    where: { siteId: fwm.id, status: 'signed_off' },
    order: [['id', 'ASC']],
  }))!;
  Object.assign(ids, {
    site: fwm.id,
    string: string.id,
    ticket: ticket.id,
    moduleModel: (await ModuleModel.findOne())!.id,
    inverterModel: (await InverterModel.findOne())!.id,
    inverter: (await Inverter.findOne({ where: { siteId: fwm.id } }))!.id,
    combinerBox: (await CombinerBox.findOne({ where: { siteId: fwm.id } }))!.id,
    user: (await User.findOne({ where: { email: demoEmail.technician } }))!.id,
  });
  for (const role of roles) agents.set(role, await signIn(demoEmail[role]));
  agents.set('otherOwner', await signIn(demoEmail.otherOwner));
});

/** The URL a caller requests: reads name demo records of Fair Wind Meadow, writes name missing ones. */
function urlOf(r: RouteEntry): string {
  const read = r.method === 'get';
  const record = (prefix: string): number => {
    if (!read) return missing;
    const byPrefix: Record<string, string> = {
      '/api/sites/': 'site',
      '/api/fleet/sites/': 'site',
      '/api/strings/': 'string',
      '/api/work-orders/': 'ticket',
      '/api/module-models/': 'moduleModel',
      '/api/inverter-models/': 'inverterModel',
      '/api/inverters/': 'inverter',
      '/api/combiner-boxes/': 'combinerBox',
      '/api/users/': 'user',
    };
    const key = byPrefix[prefix];
    return key ? Number(ids[key]) : missing; // checks, photos, mail: no demo record, so a missing one
  };
  const query: Record<string, string> = {
    '/api/inverters': `siteId=${ids.site}`,
    '/api/combiner-boxes': `siteId=${ids.site}`,
    '/api/diode-replacements': `stringId=${ids.string}`,
    '/api/fleet/metrics': 'from=2026-01-01&to=2026-12-31',
    '/api/fleet/exports/:name.csv': `siteId=${ids.site}&from=2026-01-01&to=2026-12-31`,
  };
  const path = r.path
    .replace(/^(\/api\/(?:fleet\/)?[a-z-]+\/):id/, (_m, prefix: string) => `${prefix}${record(prefix)}`)
    .replace(':size', 'thumb')
    .replace(':name.csv', 'tickets.csv');
  return query[r.path] ? `${path}?${query[r.path]}` : path;
}

// Routes that succeed with an empty request and end the caller's sessions.
const endsSession = ['post /api/auth/sign-out-everywhere'];
const existing = (r: RouteEntry) => !urlOf(r).includes(String(missing));
/** A read of one Fair Wind Meadow record, or of a list narrowed to one (?siteId=, ?stringId=). */
const readsFwm = (r: RouteEntry) =>
  r.method === 'get' && (r.path.includes(':id') || /[?&](siteId|stringId)=/.test(urlOf(r))) && existing(r);

function call(agent: Agent, r: RouteEntry, csrf?: string) {
  const req = agent[r.method as 'get' | 'post' | 'put' | 'patch' | 'delete'](urlOf(r));
  if (r.method !== 'get') void req.set('x-csrf-token', csrf ?? '').send({});
  return req;
}

it('every route has a guard: a permission from the table, signed-in, or declared public', () => {
  expect(routes.length).toBeGreaterThan(60);
  expect(routes.filter((r) => !r.guard).map((r) => `${r.method} ${r.path}`)).toEqual([]);
  // The public ones are exactly these: sign-in and password reset, and the health check.
  expect(routes.filter((r) => r.guard?.kind === 'public').map((r) => `${r.method} ${r.path}`)).toEqual([
    'get /api/health',
    'get /api/auth/csrf',
    'post /api/auth/login',
    'post /api/auth/logout',
    'post /api/auth/reset-request',
    'post /api/auth/reset',
  ]);
});

const guarded = routes.filter((r) => r.guard && r.guard.kind !== 'public');

describe.each(
  guarded.map((r) => ({ ...r, label: r.guard!.kind === 'permission' ? r.guard!.action : r.guard!.kind })),
)('$method $path ($label)', (r) => {
  it('signed out → 401', async () => {
    const anonymous = await newAgent(); // with a CSRF token of its own, so writes reach the guard
    const res = await call(anonymous, r, anonymous.csrf);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });

  it.each(
    roles.map((role) => ({ role, admitted: r.guard!.kind !== 'permission' || can(role, r.guard!.action) })),
  )('$role → admitted: $admitted', async ({ role, admitted }) => {
    const agent = agents.get(role)!;
    const res = await call(agent, r, agent.csrf);
    if (admitted && endsSession.includes(`${r.method} ${r.path}`)) {
      expect(res.status).toBe(200);
      agents.set(role, await signIn(demoEmail[role])); // the shared session has just ended
      return;
    }
    if (!admitted) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('FORBIDDEN');
      return;
    }
    const url = urlOf(r);
    if (r.method === 'get') expect(res.status, url).toBe(existing(r) ? 200 : 404);
    else
      expect([400, 404, 409], `${r.method} ${url} → ${res.status} ${JSON.stringify(res.body)}`).toContain(
        res.status,
      );
  });

  const ownerAdmitted = r.guard!.kind !== 'permission' || can('owner', r.guard!.action);
  if (ownerAdmitted && readsFwm(r)) {
    it('an owner of another site → 404', async () => {
      const res = await call(agents.get('otherOwner')!, r);
      expect(res.status).toBe(404);
    });
  }
});
