import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { expectedString } from '@stringfield/pv';
import {
  PvString,
  Site,
  StringCheck,
  User,
  WorkOrder,
  WorkOrderString,
  sequelize,
} from '../../apps/api/src/models/index.ts';
import { REPEAT_BACKFILL_SQL } from '../../apps/api/src/lib/repeat-faults.ts';
import { DEMO_PASSWORD, app, demoEmail, errorOf, resetDatabase, signIn, type Agent } from './helpers.ts';

let admin: Agent;
let owner: Agent;
let site: Site;
let s1: PvString;
let s2: PvString;
let t3: WorkOrder;

const at = (iso: string) => new Date(`${iso}Z`);

beforeAll(async () => {
  await resetDatabase({ plant: true });
  admin = await signIn(demoEmail.admin);
  owner = await signIn(demoEmail.owner);
  // A fixture site of its own, so the hand-computed figures below see only these tickets.
  const cbd = (await Site.findOne({ where: { code: 'CBD' } }))!;
  const created = await admin
    .post('/api/sites')
    .set('x-csrf-token', admin.csrf)
    .send({
      name: 'Metrics Test Field',
      code: 'MTX',
      timeZone: 'UTC',
      lowestAmbientC: -8,
      highestAmbientC: 38,
      ownerContactEmail: 'owner@stringfield.test',
      peakSunHours: 4.5,
    })
    .expect(201);
  site = (await Site.findByPk(created.body.id))!;
  const template = (await PvString.findOne({
    where: { siteId: cbd.id },
    include: [{ association: 'inverter' }],
  }))!;
  const inv = await admin
    .post('/api/inverters')
    .set('x-csrf-token', admin.csrf)
    .send({ siteId: site.id, tag: 'INV01', inverterModelId: template.inverter!.inverterModelId })
    .expect(201);
  const mk = (label: string) =>
    admin
      .post(`/api/sites/${site.id}/strings`)
      .set('x-csrf-token', admin.csrf)
      .send({
        label,
        inverterId: inv.body.id,
        mpptInput: 1,
        moduleModelId: template.moduleModelId,
        modulesInSeries: 18,
      })
      .expect(201);
  s1 = (await PvString.findByPk((await mk('INV01-MPPT1-S1')).body.id))!;
  s2 = (await PvString.findByPk((await mk('INV01-MPPT1-S2')).body.id))!;
  const dispatcherId = (await User.findOne({ where: { email: demoEmail.dispatcher } }))!.id;
  const techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  const ticket = async (n: number, fields: Partial<WorkOrder['_creationAttributes']>, stringId: number) => {
    const wo = await WorkOrder.create({
      number: `WO-2026-9${String(n).padStart(4, '0')}`,
      siteId: site.id,
      faultCategory: 'fuse',
      priority: 'P2',
      title: `Fixture ${n}`,
      description: '',
      source: 'monitoring_alert',
      status: 'signed_off',
      reportedAt: at('2026-10-01T00:00:00'),
      dueAt: at('2026-10-02T00:00:00'),
      assigneeId: techId,
      createdById: dispatcherId,
      ...fields,
    });
    await WorkOrderString.create({ workOrderId: wo.id, stringId, symptom: '' });
    return wo;
  };
  // Hand-computed fixture (hours after the report): T1 dispatch 2, submit 6, sign-off 24, no return;
  // T2 dispatch 4, submit 24, sign-off 36, returned once; T3 a repeat on S1 17 days after T1's sign-off,
  // still in the field and overdue; T4 outside the period.
  await ticket(
    1,
    {
      reportedAt: at('2026-10-02T08:00:00'),
      dispatchedAt: at('2026-10-02T10:00:00'),
      submittedAt: at('2026-10-02T14:00:00'),
      signedOffAt: at('2026-10-03T08:00:00'),
      returnCount: 0,
    },
    s1.id,
  );
  await ticket(
    2,
    {
      reportedAt: at('2026-10-05T08:00:00'),
      dispatchedAt: at('2026-10-05T12:00:00'),
      submittedAt: at('2026-10-06T08:00:00'),
      signedOffAt: at('2026-10-06T20:00:00'),
      returnCount: 1,
    },
    s2.id,
  );
  t3 = await ticket(
    3,
    {
      faultCategory: 'open_circuit',
      status: 'in_field',
      reportedAt: at('2026-10-20T08:00:00'),
      dispatchedAt: at('2026-10-20T09:00:00'),
      dueAt: at('2026-10-21T08:00:00'),
    },
    s1.id,
  );
  await ticket(
    4,
    {
      reportedAt: at('2026-09-15T08:00:00'),
      dispatchedAt: at('2026-09-15T09:00:00'),
      submittedAt: at('2026-09-15T10:00:00'),
      signedOffAt: at('2026-09-16T08:00:00'),
    },
    s2.id,
  );

  // Fixtures are written straight to the tables, so mark repeats the way bulk loads do.
  await sequelize.query(REPEAT_BACKFILL_SQL);

  const check = (
    stringId: number,
    workOrderId: number,
    verdict: 'pass' | 'fail',
    vocDeviationPct: number,
    takenAt: string,
  ) =>
    StringCheck.create({
      clientId: randomUUID(),
      workOrderId,
      stringId,
      technicianId: techId,
      phase: 'before',
      takenAt: at(takenAt),
      vocV: 700,
      iscA: 10,
      operatingCurrentA: null,
      operatingVoltageV: null,
      irradianceWm2: 1000,
      irradianceMethod: 'reference_cell',
      moduleTempC: 25,
      moduleTempMethod: 'back_sensor',
      ambientC: null,
      polarityCorrect: true,
      insulationPlusMOhm: null,
      insulationMinusMOhm: null,
      insulationTestVoltageV: null,
      instrumentIds: '',
      notes: '',
      expectedJson: null,
      vocDeviationPct,
      iscDeviationPct: 0,
      verdict,
      findingsJson: '[]',
      peersJson: '[]',
      isCalibrationOverdue: false,
      engineVersion: 'test',
      supersedesId: null,
    });
  await check(s1.id, t3.id, 'pass', 0, '2026-10-20T10:00:00');
  await check(s1.id, t3.id, 'fail', -10, '2026-10-20T11:00:00'); // the latest one counts
});

describe('fleet metrics (SQL aggregates against a hand-computed fixture)', () => {
  it('gives mean times to dispatch, repair and sign-off per site and category', async () => {
    const res = await admin
      .get(`/api/fleet/metrics?siteId=${site.id}&from=2026-10-01&to=2026-10-31`)
      .expect(200);
    const fuse = res.body.meanTimes.find((m: { faultCategory: string }) => m.faultCategory === 'fuse');
    expect(fuse).toMatchObject({ tickets: 2, toDispatchHours: 3, toRepairHours: 15, toSignOffHours: 30 });
    const open = res.body.meanTimes.find(
      (m: { faultCategory: string }) => m.faultCategory === 'open_circuit',
    );
    expect(open).toMatchObject({ tickets: 1, toDispatchHours: 1, toRepairHours: null, toSignOffHours: null });
  });

  it('counts first-time fixes, repeat faults, open and overdue tickets and the top categories', async () => {
    const res = await admin
      .get(`/api/fleet/metrics?siteId=${site.id}&from=2026-10-01&to=2026-10-31`)
      .expect(200);
    expect(res.body.firstTimeFix).toEqual({ signedOff: 2, withoutReturn: 1, rate: 0.5 });
    // S1: T3 within 90 days of T1's sign-off; S2: T2 within 90 days of T4's (signed off before the period).
    expect(res.body.repeatFaults).toEqual([
      { stringId: s1.id, label: 'INV01-MPPT1-S1', siteCode: 'MTX', repeats: 1 },
      { stringId: s2.id, label: 'INV01-MPPT1-S2', siteCode: 'MTX', repeats: 1 },
    ]);
    expect(res.body.overdueCount).toBe(1);
    expect(res.body.openByStatus).toEqual([expect.objectContaining({ status: 'in_field', count: 1 })]);
    expect(res.body.topFaultCategories).toEqual([
      { faultCategory: 'fuse', count: 2 },
      { faultCategory: 'open_circuit', count: 1 },
    ]);
  });

  it('refuses a period whose end is before its start', async () => {
    const res = await admin.get('/api/fleet/metrics?from=2026-10-31&to=2026-10-01').expect(400);
    expect(errorOf(res).fields?.to).toMatch(/must not be before/);
  });
});

describe('health map and energy at risk', () => {
  it('colours every string by its latest check and marks open tickets', async () => {
    const res = await admin.get(`/api/fleet/sites/${site.id}/health-map`).expect(200);
    const byLabel = Object.fromEntries(res.body.cells.map((c: { label: string }) => [c.label, c]));
    expect(byLabel['INV01-MPPT1-S1']).toMatchObject({
      verdict: 'fail',
      vocDeviationPct: -10,
      openTickets: 1,
    });
    expect(byLabel['INV01-MPPT1-S2']).toMatchObject({ verdict: null, openTickets: 0 });
    expect(res.body.counts).toMatchObject({ fail: 1, unchecked: 1, withOpenTickets: 1 });
  });

  it('estimates the power an open ticket is missing and a daily kWh from the site’s peak sun hours', async () => {
    const res = await admin.get(`/api/fleet/energy-at-risk?siteId=${site.id}`).expect(200);
    const module = (await PvString.findByPk(s1.id, {
      include: [{ association: 'moduleModel' }],
    }))!.moduleModel!.toSpec();
    const pmp = expectedString({ module, modulesInSeries: 18, irradianceWm2: 1000, moduleTempC: 25 }).pmpW;
    // Latest check: Voc −10 %, Isc ±0 % → implied Pmp 90 %, missing 10 %; 4.5 peak sun hours (common practice, no source).
    expect(res.body.items).toEqual([
      expect.objectContaining({ workOrderId: t3.id, missingW: Math.round(pmp * 0.1) }),
    ]);
    expect(res.body.items[0].dailyKWh).toBeCloseTo((pmp * 0.1 * 4.5) / 1000, 1);
  });

  it('keeps owners to their own sites', async () => {
    const other = await signIn(demoEmail.otherOwner);
    await other.get(`/api/fleet/sites/${site.id}/health-map`).expect(404);
    await owner.get(`/api/fleet/sites/${site.id}/health-map`).expect(404); // MTX has no owner account assigned
  });
});

describe('CSV exports', () => {
  const text = (agent: Agent, url: string) =>
    agent
      .get(url)
      .buffer(true)
      .parse((r, cb) => {
        let s = '';
        r.setEncoding('utf8');
        r.on('data', (c: string) => (s += c));
        r.on('end', () => cb(null, s));
      });

  it('streams the tickets of a site and period as CSV with a header row', async () => {
    const res = await text(
      admin,
      `/api/fleet/exports/tickets.csv?siteId=${site.id}&from=2026-10-01&to=2026-10-31`,
    ).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      /stringfield-MTX-tickets-2026-10-01-to-2026-10-31\.csv/,
    );
    const lines = (res.body as string)
      .replace(/^\uFEFF/, '')
      .trim()
      .split(/\r?\n/);
    expect(lines[0]).toBe(
      'number,site,status,priority,fault_category,title,reported_at,due_at,dispatched_at,submitted_at,signed_off_at,returns,assignee,strings',
    );
    expect(lines).toHaveLength(4);
    expect(lines[1]).toContain('WO-2026-90001,MTX,signed_off,P2,fuse,Fixture 1,2026-10-02T08:00:00.000Z');
  });

  it('exports checks with their verdicts, and refuses an unknown export', async () => {
    const res = await text(
      admin,
      `/api/fleet/exports/checks.csv?siteId=${site.id}&from=2026-10-01&to=2026-10-31`,
    ).expect(200);
    const lines = (res.body as string).trim().split(/\r?\n/);
    expect(lines).toHaveLength(3);
    expect(lines[2]).toMatch(
      /INV01-MPPT1-S1,before,2026-10-20T11:00:00\.000Z,Demo Technician,700,10,1000,25,,,-10,0,fail/,
    );
    await admin
      .get(`/api/fleet/exports/secrets.csv?siteId=${site.id}&from=2026-10-01&to=2026-10-31`)
      .expect(400);
    await admin.get('/api/fleet/exports/tickets.csv?from=2026-10-01&to=2026-10-31').expect(400);
  });

  it('writes text that a spreadsheet would run as a formula as plain text, and keeps negative numbers numbers', async () => {
    // OWASP, "CSV Injection": a cell starting with =, +, -, @, tab or carriage return is prefixed with '.
    const ticket = (await WorkOrder.findOne({ where: { number: 'WO-2026-90001' } }))!;
    const title = ticket.title;
    await ticket.update({ title: '=HYPERLINK("http://example.invalid","open")' });
    try {
      const res = await text(
        admin,
        `/api/fleet/exports/tickets.csv?siteId=${site.id}&from=2026-10-01&to=2026-10-31`,
      ).expect(200);
      expect(res.body as string).toContain(`fuse,"'=HYPERLINK(""http://example.invalid"",""open"")",`);
    } finally {
      await ticket.update({ title });
    }
    const checks = await text(
      admin,
      `/api/fleet/exports/checks.csv?siteId=${site.id}&from=2026-10-01&to=2026-10-31`,
    ).expect(200);
    expect(checks.body as string).toMatch(/,-10,0,fail/);
  });

  it('gives the database connection back when a download is cancelled half-way', async () => {
    // 20,000 copies of a fixture check: far more than one socket buffer, so the export is still
    // streaming when the client goes away.
    const cols = (
      await sequelize.query(
        "SELECT GROUP_CONCAT(column_name ORDER BY ordinal_position) AS c FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'string_checks' AND column_name NOT IN ('id', 'client_id')",
        { type: QueryTypes.SELECT },
      )
    )[0] as { c: string };
    const [template] = await sequelize.query<{ id: number }>(
      `SELECT MIN(c.id) AS id FROM string_checks c JOIN work_orders w ON w.id = c.work_order_id WHERE w.site_id = ${site.id}`,
      { type: QueryTypes.SELECT },
    );
    await sequelize.query(
      `INSERT INTO string_checks (client_id, ${cols.c}) SELECT UUID(), ${cols.c} FROM string_checks, seq_1_to_20000 WHERE id = ${template!.id}`,
    );

    const server = app().listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    try {
      const cookieOf = (res: Response) =>
        res.headers
          .getSetCookie()
          .map((c) => c.split(';')[0])
          .join('; ');
      const first = await fetch(`${base}/api/auth/csrf`);
      const { csrfToken } = (await first.json()) as { csrfToken: string };
      const login = await fetch(`${base}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookieOf(first) },
        body: JSON.stringify({ email: demoEmail.admin, password: DEMO_PASSWORD }),
      });
      expect(login.status).toBe(200);
      const cookie = cookieOf(login);
      const url = `${base}/api/fleet/exports/checks.csv?siteId=${site.id}&from=2026-01-01&to=2026-12-31`;

      // More cancelled downloads than the pool has connections (DB_POOL_MAX 10).
      for (let i = 0; i < 11; i += 1) {
        const abort = new AbortController();
        // Uncompressed, so the rows cannot all fit in socket and zlib buffers before the client leaves.
        const res = await fetch(url, { headers: { cookie, 'accept-encoding': 'identity' }, signal: abort.signal });
        expect(res.status).toBe(200);
        const reader = res.body!.getReader();
        expect((await reader.read()).done).toBe(false);
        abort.abort();
        await reader.cancel().catch(() => undefined);
      }
      // Every connection came back: an ordinary request is answered, and no export query is left running.
      const metricsRes = await fetch(`${base}/api/fleet/metrics?from=2026-10-01&to=2026-10-31`, {
        headers: { cookie },
      });
      expect(metricsRes.status).toBe(200);
      await expect
        .poll(
          async () =>
            (
              await sequelize.query(
                "SELECT COUNT(*) AS n FROM information_schema.processlist WHERE info LIKE '%JSON_VALUE(c.expected_json%' AND info NOT LIKE '%processlist%'",
                { type: QueryTypes.SELECT },
              )
            )[0],
          { timeout: 5000 },
        )
        .toEqual({ n: 0 });
      // And a download read to the end still has every row.
      const whole = await (await fetch(url, { headers: { cookie } })).text();
      expect(whole.trim().split(/\r?\n/)).toHaveLength(1 + 2 + 20_000);
    } finally {
      await new Promise((r) => server.close(r));
      await sequelize.query(
        `DELETE FROM string_checks WHERE id > ${template!.id} AND work_order_id IN (SELECT id FROM work_orders WHERE site_id = ${site.id})`,
      );
    }
  });

  it('is not for technicians', async () => {
    const tech = await signIn(demoEmail.technician);
    await tech
      .get(`/api/fleet/exports/tickets.csv?siteId=${site.id}&from=2026-10-01&to=2026-10-31`)
      .expect(403);
  });
});
