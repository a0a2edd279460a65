import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import supertest from 'supertest';
import { PvString, Site, User, WorkOrder } from '../../apps/api/src/models/index.ts';
import { app, demoEmail, resetDatabase, signIn, type Agent } from './helpers.ts';

let admin: Agent;
let dispatcher: Agent;
let tech: Agent;
let ticketId: number;

beforeAll(async () => {
  await resetDatabase({ plant: true });
  [admin, dispatcher, tech] = await Promise.all([signIn(demoEmail.admin), signIn(demoEmail.dispatcher), signIn(demoEmail.technician)]);
  const techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  ticketId = (await WorkOrder.findOne({ where: { assigneeId: techId, status: 'in_field' } }))!.id;
});

// Random and boundary payloads for every JSON write route: none may answer 5xx, and none may write
// anything when it is refused (row counts are compared before and after).
const routes: Array<{ name: string; agent: () => Agent; method: 'post' | 'patch' | 'put'; path: () => string }> = [
  { name: 'sign-in', agent: () => dispatcher, method: 'post', path: () => '/api/auth/login' },
  { name: 'invite user', agent: () => admin, method: 'post', path: () => '/api/users' },
  { name: 'create site', agent: () => admin, method: 'post', path: () => '/api/sites' },
  { name: 'module model', agent: () => admin, method: 'post', path: () => '/api/module-models' },
  { name: 'create ticket', agent: () => dispatcher, method: 'post', path: () => '/api/work-orders' },
  { name: 'transition', agent: () => dispatcher, method: 'post', path: () => `/api/work-orders/${ticketId}/transitions` },
  { name: 'edit ticket', agent: () => dispatcher, method: 'patch', path: () => `/api/work-orders/${ticketId}` },
  { name: 'string check', agent: () => tech, method: 'post', path: () => `/api/work-orders/${ticketId}/checks` },
  { name: 'diode record', agent: () => tech, method: 'post', path: () => `/api/work-orders/${ticketId}/diode-replacements` },
  { name: 'sign-off', agent: () => dispatcher, method: 'post', path: () => `/api/work-orders/${ticketId}/sign-off` },
  { name: 'mail preferences', agent: () => tech, method: 'put', path: () => '/api/me/mail-preferences' },
];

const boundary = fc.oneof(
  fc.constantFrom(0, -1, 1e308, -1e308, Number.MAX_SAFE_INTEGER, 1500, 1500.0001, -40, 100.5, '', ' ', 'null', '1e309', '0x10', true, false, null),
  fc.string({ maxLength: 300 }),
  fc.constantFrom("' OR 1=1 --", '"; DROP TABLE users; --', '<script>alert(1)</script>', '\u0000', '../../etc/passwd', '𝔘𝔫𝔦𝔠𝔬𝔡𝔢'),
);
const payload = fc.oneof(
  fc.anything({ maxDepth: 2 }),
  fc.dictionary(
    fc.constantFrom('email', 'password', 'name', 'role', 'code', 'siteId', 'strings', 'to', 'version', 'reason', 'assigneeId', 'vocV', 'iscA', 'clientId', 'stringId', 'phase', 'takenAt', 'title', 'optOut', 'overrides', 'timeZone', 'lowestAmbientC', 'highestAmbientC', 'modulePosition', 'diodePosition'),
    boundary,
    { maxKeys: 8 },
  ),
);

/** The body as JSON text, exactly as a hostile client could send it (primitives included). */
const json = (body: unknown) => JSON.stringify(body) ?? 'null';

async function counts() {
  return [await User.count(), await Site.count(), await WorkOrder.count(), await PvString.count()].join(',');
}

describe('hostile and random input', () => {
  it.each(routes)('never answers 5xx to random bodies on $name', async ({ agent, method, path }) => {
    await fc.assert(
      fc.asyncProperty(payload, async (body) => {
        const res = await agent()[method](path()).set('x-csrf-token', agent().csrf).set('content-type', 'application/json').send(json(body));
        expect(res.status, JSON.stringify(res.body)).toBeLessThan(500);
        if (res.status >= 400) expect(res.body.error?.message).toEqual(expect.any(String));
      }),
      { numRuns: 40 },
    );
  });

  it('writes nothing when random bodies are refused', async () => {
    const before = await counts();
    for (const body of fc.sample(payload, 60)) {
      const res = await dispatcher.post('/api/work-orders').set('x-csrf-token', dispatcher.csrf).set('content-type', 'application/json').send(json(body));
      expect(res.status).toBeGreaterThanOrEqual(400);
    }
    expect(await counts()).toBe(before);
  });

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
