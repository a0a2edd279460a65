import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import supertest from 'supertest';
import { QueryTypes } from 'sequelize';
import { can, roles, type Role } from '@stringfield/shared';
import { mailIdle } from '../../apps/api/src/lib/mailer.ts';
import { routeTable, type RouteEntry } from '../../apps/api/src/lib/route-table.ts';
import {
  CombinerBox,
  DiodeReplacement,
  Inverter,
  InverterModel,
  MailOutbox,
  ModuleModel,
  Photo,
  StringCheck,
  User,
  WorkOrder,
  WorkOrderString,
  sequelize,
} from '../../apps/api/src/models/index.ts';
import { app, demoEmail, resetDatabase, signIn, type Agent } from './helpers.ts';

let dispatcher: Agent;
let ticketId: number;
const ids: Record<string, number> = {};
const agents = new Map<Role, Agent>();

const routes = routeTable(app()).filter((r) => r.path.startsWith('/api/'));
// These take no body and end the caller's sessions: random bodies would only sign the fuzzing agents out.
const endsSession = ['post /api/auth/logout', 'post /api/auth/sign-out-everywhere'];
const writes = routes.filter((r) => ['post', 'put', 'patch'].includes(r.method) && !endsSession.includes(`${r.method} ${r.path}`));
const reads = routes.filter((r) => r.method === 'get');
// Tables a refused request may still touch by design: its session, and the sign-in limiter's count.
const volatile = new Set(['sessions', 'rate_limit_hits', 'schema_migrations']);
let tables: string[] = [];

beforeAll(async () => {
  await resetDatabase({ plant: true });
  for (const role of roles) agents.set(role, await signIn(demoEmail[role]));
  dispatcher = agents.get('dispatcher')!;
  const techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  const ticket = (await WorkOrder.findOne({ where: { assigneeId: techId, status: 'in_field' }, order: [['id', 'ASC']] }))!;
  ticketId = ticket.id;
  const string = (await WorkOrderString.findOne({ where: { workOrderId: ticket.id } }))!;
  // A user of its own for PATCH /api/users/:id, so that a lucky random body cannot lock a fuzzing agent out.
  const invited = await agents.get('admin')!.post('/api/users').set('x-csrf-token', agents.get('admin')!.csrf)
    .send({ email: 'fuzz-target@stringfield.test', name: 'Fuzz Target', role: 'technician' });
  expect(invited.status).toBe(201);
  // An instrument of the register for PATCH /api/instruments/:id (the demo seed registers none).
  const tech = agents.get('technician')!;
  const meter = await tech.post('/api/instruments').set('x-csrf-token', tech.csrf).send({ kind: 'multimeter', serial: 'MM-FUZZ-0001', calibrationDueOn: '2027-06-30' });
  expect(meter.status).toBe(201);
  await mailIdle();
  Object.assign(ids, {
    site: ticket.siteId,
    string: string.stringId,
    ticket: ticket.id,
    moduleModel: (await ModuleModel.findOne())!.id,
    inverterModel: (await InverterModel.findOne())!.id,
    inverter: (await Inverter.findOne({ where: { siteId: ticket.siteId } }))?.id ?? (await Inverter.findOne())!.id,
    combinerBox: (await CombinerBox.findOne({ order: [['id', 'ASC']] }))!.id,
    user: invited.body.id as number,
    check: (await StringCheck.findOne({ order: [['id', 'ASC']] }))?.id ?? 999_999,
    photo: (await Photo.findOne({ order: [['id', 'ASC']] }))?.id ?? 999_999,
    diode: (await DiodeReplacement.findOne({ order: [['id', 'ASC']] }))?.id ?? 999_999,
    instrument: meter.body.id as number,
    mail: (await MailOutbox.findOne({ order: [['id', 'ASC']] }))!.id,
  });
  tables = (await sequelize.query<Record<string, string>>('SHOW TABLES', { type: QueryTypes.SELECT }))
    .map((row) => Object.values(row)[0]!)
    .filter((t) => !volatile.has(t));
});

/** The route's path with real records of the demo plant (the technician's ticket in the field). */
function pathOf(r: RouteEntry): string {
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
    '/api/checks/': 'check',
    '/api/photos/': 'photo',
    '/api/diode-replacements/': 'diode',
    '/api/instruments/': 'instrument',
    '/api/mail/': 'mail',
  };
  return r.path
    .replace(/^(\/api\/(?:fleet\/)?[a-z-]+\/):id/, (_m, prefix: string) => {
      // A route on a kind of record not listed here would only ever be fuzzed as "not found".
      const id = ids[byPrefix[prefix] ?? ''];
      if (id === undefined) throw new Error(`${r.method} ${r.path}: add its records to pathOf`);
      return `${prefix}${id}`;
    })
    .replace(':size', 'thumb')
    .replace(':name.csv', 'checks.csv');
}

// The caller: a role the route's own guard admits, the technician first (the ticket is theirs).
const preference: Role[] = ['technician', 'dispatcher', 'supervisor', 'admin', 'owner'];
function agentFor(r: RouteEntry): Agent {
  const role = preference.find((x) => r.guard?.kind !== 'permission' || can(x, r.guard.action))!;
  return agents.get(role)!;
}

const boundary = fc.oneof(
  fc.constantFrom(0, -1, 1e308, -1e308, Number.MAX_SAFE_INTEGER, 1500, 1500.0001, -40, 100.5, '', ' ', 'null', '1e309', '0x10', true, false, null),
  fc.string({ maxLength: 300 }),
  fc.constantFrom("' OR 1=1 --", '"; DROP TABLE users; --', '<script>alert(1)</script>', '\u0000', '../../etc/passwd', '𝔘𝔫𝔦𝔠𝔬𝔡𝔢'),
  fc.constantFrom(1, 2, 3, 999_999, '2026-11-30T10:15:00Z', '2026-02-30', 'P1', 'dispatched', 'before', 'after', 'open_circuit'),
);
const fields = fc.constantFrom(
  'email', 'password', 'currentPassword', 'newPassword', 'token', 'name', 'role', 'isActive', 'code', 'siteId', 'strings',
  'stringIds', 'to', 'version', 'reason', 'assigneeId', 'vocV', 'iscA', 'irradianceWm2', 'moduleTempC', 'clientId',
  'stringId', 'phase', 'takenAt', 'title', 'description', 'priority', 'faultCategory', 'optOut', 'overrides',
  'timeZone', 'lowestAmbientC', 'highestAmbientC', 'modulePosition', 'diodePosition', 'comment', 'body', 'points',
  'insulationMohm', 'instrumentId', 'serial', 'checks',
);
const payload = fc.oneof(fc.anything({ maxDepth: 2 }), fc.dictionary(fields, boundary, { maxKeys: 8 }));
const query = fc.dictionary(
  fc.constantFrom('page', 'pageSize', 'sort', 'q', 'status', 'priority', 'siteId', 'stringId', 'assigneeId', 'overdue', 'open', 'ids', 'faultCategory', 'from', 'to', 'phase', 'role', 'days'),
  boundary.map((v) => (v === null ? '' : String(v))),
  { maxKeys: 5 },
);

/** The body as JSON text, exactly as a hostile client could send it (primitives included). */
const json = (body: unknown) => JSON.stringify(body) ?? 'null';

/** One checksum per table the request could have written to (everything but sessions and the limiter). */
async function snapshot(): Promise<string> {
  const rows = await sequelize.query<{ Table: string; Checksum: number }>(
    `CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(', ')}`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => `${r.Table}=${r.Checksum}`).join(' ');
}

describe('random and boundary bodies on every JSON write route', () => {
  it('covers the routes the app serves', () => {
    expect(writes.length).toBeGreaterThan(30);
  });
  it.each(writes.map((r) => ({ ...r, label: `${r.method.toUpperCase()} ${r.path}` })))('$label: no 5xx, nothing written when refused', async (r) => {
    const agent = agentFor(r);
    await fc.assert(
      fc.asyncProperty(payload, async (body) => {
        await mailIdle(); // mail queued by an earlier accepted request is sent in the background
        const before = await snapshot();
        const res = await agent[r.method as 'post' | 'put' | 'patch'](pathOf(r))
          .set('x-csrf-token', agent.csrf)
          .set('content-type', 'application/json')
          .send(json(body));
        expect(res.status, JSON.stringify(res.body)).toBeLessThan(500);
        if (res.status >= 400) {
          expect(res.body.error?.message).toEqual(expect.any(String));
          await mailIdle();
          expect(await snapshot()).toBe(before);
        }
      }),
      { numRuns: 20 },
    );
  });
});

describe('random and boundary query strings on every read route', () => {
  it.each(reads.map((r) => ({ ...r, label: `GET ${r.path}` })))('$label: no 5xx', async (r) => {
    const agent = agentFor(r);
    await fc.assert(
      fc.asyncProperty(query, async (q) => {
        const res = await agent.get(`${pathOf(r)}?${new URLSearchParams(q).toString()}`);
        expect(res.status, JSON.stringify(res.body)).toBeLessThan(500);
        if (res.status >= 400 && res.type === 'application/json') expect(res.body.error?.message).toEqual(expect.any(String));
      }),
      { numRuns: 12 },
    );
  });
});

describe('hostile input', () => {
  it('keeps SQL-injection text in searches inert (parameterised) and returns stored text unchanged', async () => {
    const normal = await dispatcher.get('/api/work-orders?pageSize=5').expect(200);
    const injected = await dispatcher.get(`/api/work-orders?q=${encodeURIComponent("' OR 1=1 --")}`).expect(200);
    expect(injected.body.total).toBe(0);
    expect(normal.body.total).toBeGreaterThan(0);
    await dispatcher.get(`/api/sites?q=${encodeURIComponent('%')}`).expect(200);
    const xss = '<img src=x onerror=alert(1)> & "quotes"';
    const t = await dispatcher.patch(`/api/work-orders/${ticketId}`).set('x-csrf-token', dispatcher.csrf).send({ version: (await dispatcher.get(`/api/work-orders/${ticketId}`)).body.version, title: xss }).expect(200);
    expect(t.body.title).toBe(xss);
    expect(t.headers['content-type']).toMatch(/application\/json/);
  });

  it('sends security headers: a CSP allowing only our own scripts, no framing, no X-Powered-By', async () => {
    const res = await supertest(app()).get('/api/health');
    expect(res.headers['content-security-policy']).toMatch(/script-src 'self'/);
    expect(res.headers['content-security-policy']).toMatch(/frame-ancestors 'none'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
