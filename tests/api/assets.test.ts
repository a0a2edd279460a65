import { beforeAll, describe, expect, it } from 'vitest';
import { demoEmail, errorOf, resetDatabase, signIn, type Agent } from './helpers.ts';

let admin: Agent;
let dispatcher: Agent;
let tech: Agent;
let owner: Agent;
let otherOwner: Agent;
let siteIds: Record<string, number>;

beforeAll(async () => {
  await resetDatabase({ plant: true });
  [admin, dispatcher, tech, owner, otherOwner] = await Promise.all([
    signIn(demoEmail.admin),
    signIn(demoEmail.dispatcher),
    signIn(demoEmail.technician),
    signIn(demoEmail.owner),
    signIn(demoEmail.otherOwner),
  ]);
  const sites = await admin.get('/api/sites').expect(200);
  siteIds = Object.fromEntries(sites.body.items.map((s: { code: string; id: number }) => [s.code, s.id]));
});

describe('sites', () => {
  it('lists the three demo sites with their string counts for a dispatcher', async () => {
    const res = await dispatcher.get('/api/sites?sort=code').expect(200);
    expect(res.body.total).toBe(3);
    const byCode = Object.fromEntries(res.body.items.map((s: { code: string }) => [s.code, s]));
    expect(byCode.FWM).toMatchObject({ stringCount: 600, inverterCount: 25 });
    expect(byCode.OSR).toMatchObject({ stringCount: 192, inverterCount: 8 });
    expect(byCode.CBD).toMatchObject({ stringCount: 40, inverterCount: 10 });
  });

  it('shows an owner only the sites assigned to their account, and 404 for the others', async () => {
    const mine = await owner.get('/api/sites').expect(200);
    expect(mine.body.items.map((s: { code: string }) => s.code).sort()).toEqual(['FWM', 'OSR']);
    const other = await otherOwner.get('/api/sites').expect(200);
    expect(other.body.items.map((s: { code: string }) => s.code)).toEqual(['CBD']);
    await otherOwner.get(`/api/sites/${siteIds.FWM}`).expect(404);
    await otherOwner.get(`/api/sites/${siteIds.FWM}/strings`).expect(404);
  });

  it('counts the deliberately over-long Ostrander Ridge strings as sizing failures (28 × 49.8 V at −31 °C > 1500 V)', async () => {
    const res = await admin.get(`/api/sites/${siteIds.OSR}`).expect(200);
    // 24 strings on inverter 8 are 28 modules long; the 25-module strings pass.
    expect(res.body.sizingFailCount).toBe(24);
    const failing = await admin.get(`/api/sites/${siteIds.OSR}/strings?sizing=fail&pageSize=50`).expect(200);
    expect(failing.body.total).toBe(24);
    expect(failing.body.items.every((s: { inverterTag: string }) => s.inverterTag === 'INV08')).toBe(true);
    expect(failing.body.items[0].sizingFailures).toContain('COLD_VOC_BELOW_MAX_DC');
  });

  it('refuses a site whose highest ambient is below its lowest, naming the field', async () => {
    const res = await admin
      .post('/api/sites')
      .set('x-csrf-token', admin.csrf)
      .send({ name: 'Test Flats', code: 'TFL', timeZone: 'Europe/Berlin', lowestAmbientC: 10, highestAmbientC: 5, ownerContactEmail: 'a@b.test' })
      .expect(400);
    expect(errorOf(res).fields?.highestAmbientC).toMatch(/above the lowest/);
  });

  it('lets a dispatcher create a site, refuses a duplicate code, and refuses a technician', async () => {
    const body = { name: 'Test Flats', code: 'TFL', timeZone: 'Europe/Berlin', lowestAmbientC: -10, highestAmbientC: 35, ownerContactEmail: 'owner@stringfield.test' };
    await dispatcher.post('/api/sites').set('x-csrf-token', dispatcher.csrf).send(body).expect(201);
    await dispatcher.post('/api/sites').set('x-csrf-token', dispatcher.csrf).send(body).expect(409);
    await tech.post('/api/sites').set('x-csrf-token', tech.csrf).send({ ...body, code: 'TF2' }).expect(403);
    await owner.post('/api/sites').set('x-csrf-token', owner.csrf).send({ ...body, code: 'TF3' }).expect(403);
  });

  it('refuses to delete a site that has strings (409, archive instead)', async () => {
    const res = await admin.delete(`/api/sites/${siteIds.CBD}`).set('x-csrf-token', admin.csrf).expect(409);
    expect(errorOf(res).message).toMatch(/Archive/);
  });
});

describe('strings', () => {
  it('paginates a site’s strings server-side with a filter and sort', async () => {
    const page = await tech.get(`/api/sites/${siteIds.FWM}/strings?pageSize=24&page=2&sort=inverter`).expect(200);
    expect(page.body).toMatchObject({ total: 600, page: 2, pageSize: 24 });
    expect(page.body.items[0].label).toBe('INV02-MPPT1-S1');
    const search = await tech.get(`/api/sites/${siteIds.FWM}/strings?q=INV07-MPPT3`).expect(200);
    expect(search.body.total).toBe(4);
    expect(search.body.items[0]).toMatchObject({ inverterTag: 'INV07', mpptInput: 3, combinerTag: 'CB-07A' });
    await tech.get(`/api/sites/${siteIds.FWM}/strings?pageSize=201`).expect(400);
  });

  it('gives a string page its datasheet, inverter window and named sizing checks', async () => {
    const list = await tech.get(`/api/sites/${siteIds.OSR}/strings?q=INV08-MPPT1-S1`).expect(200);
    const detail = await tech.get(`/api/strings/${list.body.items[0].id}`).expect(200);
    expect(detail.body.module).toMatchObject({ model: 'SDM-405-72M', vocV: 49.8, bypassDiodes: 3 });
    expect(detail.body.inverter.model).toMatchObject({ maxDcV: 1500, mpptMinV: 600 });
    const cold = detail.body.sizing.find((c: { code: string }) => c.code === 'COLD_VOC_BELOW_MAX_DC');
    // NEC 690.7(A)(1) coefficient method: 28 × 49.8 V × (1 + (−0.0027)·(−31 − 25)) = 1605.4 V [derived]
    expect(cold.value).toBeCloseTo(28 * 49.8 * (1 + -0.0027 * (-31 - 25)), 1);
    expect(cold).toMatchObject({ ok: false, limit: 1500, unit: 'V' });
  });

  it('refuses a string on an MPPT input the inverter does not have', async () => {
    const inverters = await admin.get(`/api/inverters?siteId=${siteIds.CBD}`).expect(200);
    const modules = await admin.get('/api/module-models?q=SDM-330').expect(200);
    const res = await admin
      .post(`/api/sites/${siteIds.CBD}/strings`)
      .set('x-csrf-token', admin.csrf)
      .send({ label: 'INV01-MPPT3-S1', inverterId: inverters.body[0].id, mpptInput: 3, moduleModelId: modules.body.items[0].id, modulesInSeries: 18 })
      .expect(400);
    expect(errorOf(res).fields?.mpptInput).toMatch(/1 to 2/);
  });
});

describe('datasheet libraries', () => {
  const goodModule = {
    maker: 'Test Modules',
    model: 'TM-400',
    cellTechnology: 'mono-PERC',
    pmaxW: 400,
    vocV: 49.5,
    iscA: 10.3,
    vmpV: 41.5,
    impA: 9.64,
    alphaIscPctPerC: 0.05,
    betaVocPctPerC: -0.28,
    gammaPmaxPctPerC: -0.35,
    cellsInSeries: 72,
    bypassDiodes: 3,
  };

  it.each([
    [{ vmpV: 50 }, 'vmpV', /below Voc/],
    [{ impA: 11 }, 'impA', /below Isc/],
    [{ betaVocPctPerC: 0.29 }, 'betaVocPctPerC', /negative/],
    [{ cellsInSeries: 0 }, 'cellsInSeries', /at least one cell/],
  ])('refuses a datasheet with %o on the right field', async (patch, field, message) => {
    const res = await dispatcher.post('/api/module-models').set('x-csrf-token', dispatcher.csrf).send({ ...goodModule, ...patch }).expect(400);
    expect(errorOf(res).fields?.[field]).toMatch(message);
  });

  it('adds a valid module model, refuses the same maker and model twice, and refuses deleting one in use', async () => {
    await dispatcher.post('/api/module-models').set('x-csrf-token', dispatcher.csrf).send(goodModule).expect(201);
    await dispatcher.post('/api/module-models').set('x-csrf-token', dispatcher.csrf).send(goodModule).expect(409);
    const used = await admin.get('/api/module-models?q=SDM-550').expect(200);
    expect(used.body.items[0].stringCount).toBe(600);
    const res = await admin.delete(`/api/module-models/${used.body.items[0].id}`).set('x-csrf-token', admin.csrf).expect(409);
    expect(errorOf(res).message).toMatch(/Archive it/);
  });

  it('refuses an inverter model whose MPPT window is upside down', async () => {
    const res = await admin
      .post('/api/inverter-models')
      .set('x-csrf-token', admin.csrf)
      .send({ maker: 'T', model: 'T1', maxDcV: 1000, mpptMinV: 800, mpptMaxV: 300, startV: 200, mpptInputs: 2, maxInputA: 20, maxInputIscA: 30, ratedAcW: 20000, maxDcW: 30000 })
      .expect(400);
    expect(errorOf(res).fields?.mpptMaxV).toMatch(/above the MPPT minimum/);
  });
});
