import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { simulateString } from '@stringfield/pv';
import { StringCheck, User } from '../../apps/api/src/models/index.ts';
import { demoEmail, errorOf, resetDatabase, signIn, type Agent } from './helpers.ts';

let dispatcher: Agent;
let tech: Agent;
let rosa: Agent;
let ticket: { id: number; number: string };
let strings: Array<{ id: number; label: string }>;

// Demo module SDM-330-60P (invented): Voc 40.6 V, Isc 10.30 A, 3 bypass diodes; 18 in series on CBD.
const stcVocV = 18 * 40.6;

beforeAll(async () => {
  await resetDatabase({ plant: true });
  dispatcher = await signIn(demoEmail.dispatcher);
  tech = await signIn(demoEmail.technician);
  rosa = await signIn('rosa.quill@stringfield.test');
  const sites = await dispatcher.get('/api/sites?q=CBD').expect(200);
  const siteId = sites.body.items[0].id as number;
  strings = (await dispatcher.get(`/api/sites/${siteId}/strings?q=INV06-MPPT1`).expect(200)).body.items;
  const techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  const created = await dispatcher
    .post('/api/work-orders')
    .set('x-csrf-token', dispatcher.csrf)
    .send({ siteId, strings: strings.map((s) => ({ stringId: s.id, symptom: 'low yield' })), faultCategory: 'low_voltage', priority: 'P2', title: 'Check INV06 input 1', source: 'monitoring_alert', assigneeId: techId })
    .expect(201);
  ticket = created.body.items[0];
  await tech.post(`/api/work-orders/${ticket.id}/transitions`).set('x-csrf-token', tech.csrf).send({ to: 'in_field', version: created.body.items[0].version }).expect(200);
});

function check(overrides: Record<string, unknown> = {}) {
  return {
    clientId: randomUUID(),
    stringId: strings[0]!.id,
    phase: 'before',
    takenAt: new Date().toISOString(),
    vocV: stcVocV,
    iscA: 10.3,
    irradianceWm2: 1000,
    irradianceMethod: 'reference_cell',
    moduleTempC: 25,
    moduleTempMethod: 'back_sensor',
    polarityCorrect: true,
    ...overrides,
  };
}

const post = (agent: Agent, body: Record<string, unknown>) =>
  agent.post(`/api/work-orders/${ticket.id}/checks`).set('x-csrf-token', agent.csrf).send(body);

describe('string checks', () => {
  it('computes the verdict on the server and ignores one sent by the client', async () => {
    const res = await post(tech, { ...check(), verdict: 'fail' }).expect(201);
    expect(res.body.verdict).toBe('pass');
    // Expected Voc at STC = 18 × 40.6 V = 730.8 V (demo datasheet, STC translation is the identity).
    expect(res.body.expected.vocV).toBeCloseTo(stcVocV, 1);
    expect(res.body.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('flags one bypassed substring when Voc is one third of a module short', async () => {
    const res = await post(tech, check({ vocV: stcVocV - 40.6 / 3, stringId: strings[1]!.id })).expect(201);
    expect(res.body.verdict).not.toBe('pass');
    expect(res.body.findings.map((f: { code: string }) => f.code)).toContain('SUBSTRINGS_BYPASSED');
  });

  it('fails a negative Voc as reversed polarity and says not to connect', async () => {
    const res = await post(tech, check({ vocV: -stcVocV, polarityCorrect: false })).expect(201);
    expect(res.body.verdict).toBe('fail');
    const f = res.body.findings.find((x: { code: string }) => x.code === 'REVERSE_POLARITY');
    expect(f.message).toMatch(/do not (connect|close)/i);
  });

  it('fails insulation below the IEC 62446 minimum (1 MΩ above 120 V systems, from memory)', async () => {
    const res = await post(tech, check({ insulationPlusMOhm: 0.4, insulationMinusMOhm: 30, insulationTestVoltageV: 1000 })).expect(201);
    expect(res.body.verdict).toBe('fail');
    expect(res.body.findings.map((f: { code: string }) => f.code)).toContain('INSULATION_LOW');
  });

  it('creates one check when the same client id is sent twice (retry or offline queue)', async () => {
    const body = check();
    const first = await post(tech, body).expect(201);
    const second = await post(tech, body).expect(200);
    expect(second.body.id).toBe(first.body.id);
    expect(await StringCheck.count({ where: { clientId: body.clientId } })).toBe(1);
  });

  it('keeps a corrected check as a new revision that supersedes the old one', async () => {
    const original = await post(tech, check({ vocV: 700 })).expect(201);
    const revised = await tech
      .post(`/api/checks/${original.body.id}/revisions`)
      .set('x-csrf-token', tech.csrf)
      .send(check({ vocV: stcVocV, notes: 'Typo: read 730.8 V, not 700 V' }))
      .expect(201);
    expect(revised.body.supersedesId).toBe(original.body.id);
    const current = await tech.get(`/api/work-orders/${ticket.id}/checks`).expect(200);
    const ids = current.body.items.map((c: { id: number }) => c.id);
    expect(ids).toContain(revised.body.id);
    expect(ids).not.toContain(original.body.id);
    const all = await tech.get(`/api/work-orders/${ticket.id}/checks?includeSuperseded=true`).expect(200);
    expect(all.body.items.find((c: { id: number }) => c.id === original.body.id).supersededById).toBe(revised.body.id);
    await tech.post(`/api/checks/${original.body.id}/revisions`).set('x-csrf-token', tech.csrf).send(check()).expect(409);
  });

  it('saves a check made with an instrument past its calibration date, flagged', async () => {
    const meter = await tech
      .post('/api/instruments')
      .set('x-csrf-token', tech.csrf)
      .send({ kind: 'multimeter', serial: 'MM-0042-LFS', calibrationDueOn: '2025-01-31' })
      .expect(201);
    expect(meter.body.isCalibrationOverdue).toBe(true);
    const res = await post(tech, check({ instrumentIds: [meter.body.id] })).expect(201);
    expect(res.body.isCalibrationOverdue).toBe(true);
    expect(res.body.verdict).toBe('attention');
    expect(res.body.findings.map((f: { code: string }) => f.code)).toContain('INSTRUMENT_CALIBRATION_OVERDUE');
  });

  it('compares with the strings on the same inverter input measured within 15 minutes', async () => {
    const t0 = Date.now();
    await post(tech, check({ stringId: strings[0]!.id, takenAt: new Date(t0 - 5 * 60_000).toISOString(), vocV: 731 })).expect(201);
    const res = await post(tech, check({ stringId: strings[1]!.id, takenAt: new Date(t0).toISOString(), vocV: 729 })).expect(201);
    expect(res.body.peers.map((p: { stringLabel: string }) => p.stringLabel)).toContain(strings[0]!.label);
  });

  it.each([
    [{ iscA: -1 }, 'iscA', /at least 0/],
    [{ vocV: 1600 }, 'vocV', /at most 1500/],
    [{ irradianceWm2: 2000 }, 'irradianceWm2', /at most 1500/],
    [{ moduleTempC: 120 }, 'moduleTempC', /at most 100/],
    [{ vocV: 'seven hundred' }, 'vocV', /must be a number/],
    [{ irradianceMethod: undefined }, 'irradianceMethod', /how the irradiance/],
  ])('refuses %o with a message on the field', async (patch, field, message) => {
    const res = await post(tech, check(patch)).expect(400);
    expect(errorOf(res).fields?.[field]).toMatch(message);
  });

  it('refuses checks from another technician and from a dispatcher', async () => {
    await post(rosa, check()).expect(403);
    await post(dispatcher, check()).expect(403);
  });

  it('shows a string’s checks across tickets', async () => {
    const res = await dispatcher.get(`/api/strings/${strings[0]!.id}/checks`).expect(200);
    expect(res.body.items.length).toBeGreaterThan(0);
    expect(res.body.items[0]).toMatchObject({ stringId: strings[0]!.id, workOrderNumber: ticket.number });
  });
});

describe('I-V traces', () => {
  // A generated trace (marked as such): simulateString of the demo string with one substring fully
  // shaded, plus ±0.5 % multiplicative noise from a fixed-seed generator.
  function generatedTraceCsv({ semicolon = false } = {}) {
    const sim = simulateString({
      module: { pmaxW: 330, vocV: 40.6, iscA: 10.3, vmpV: 33.8, impA: 9.77, alphaIscPctPerC: 0.05, betaVocPctPerC: -0.3, gammaPmaxPctPerC: -0.38, cellsInSeries: 60, bypassDiodes: 3, noctC: 45 },
      modulesInSeries: 18,
      irradianceWm2: 900,
      moduleTempC: 40,
      // Positions are 0-based: cells 0…19 of the first module are its first substring.
      shading: Array.from({ length: 20 }, (_, cell) => ({ module: 0, cell, fraction: 0.8 })),
      points: 200,
    });
    let seed = 7;
    const noise = () => {
      seed = (seed * 16807) % 2147483647;
      return 1 + ((seed / 2147483647) - 0.5) * 0.01;
    };
    const sep = semicolon ? ';' : ',';
    const num = (x: number) => (semicolon ? x.toFixed(3).replace('.', ',') : x.toFixed(3));
    const rows = sim.curve.filter((p) => p.voltageV >= 0 && p.currentA >= 0).map((p) => `${num(p.voltageV)}${sep}${num(p.currentA * noise())}`);
    return { csv: `# generated by simulateString for tests\nIrradiance${sep}900\nTemperature${sep}40\nvoltage${sep}current\n${rows.join('\n')}\n`, sim };
  }

  it('analyses a trace, finds the bypass step, and keeps the STC translation with its coefficients', async () => {
    const created = await post(tech, check({ irradianceWm2: 900, moduleTempC: 40 })).expect(201);
    const { csv, sim } = generatedTraceCsv({ semicolon: true });
    const res = await tech
      .post(`/api/checks/${created.body.id}/iv-trace`)
      .set('x-csrf-token', tech.csrf)
      .attach('file', Buffer.from(csv), 'trace.csv')
      .expect(201);
    expect(res.body.analysis.pmpW).toBeCloseTo(sim.pmpW, -2);
    expect(res.body.analysis.steps.length).toBeGreaterThanOrEqual(1);
    expect(res.body.analysis.likelyBypassedSubstrings).toBe(1);
    expect(res.body.translation).toMatchObject({ procedure: 1, isApproximate: true });
    // At STC (1000 W/m², 25 °C) the translated Isc is higher than at 900 W/m².
    expect(res.body.stcAnalysis.iscA).toBeGreaterThan(res.body.analysis.iscA);
    const again = await dispatcher.get(`/api/checks/${created.body.id}/iv-trace`).expect(200);
    expect(again.body.points.length).toBe(res.body.points.length);
  });

  it('names the line of a malformed trace and stores nothing', async () => {
    const created = await post(tech, check()).expect(201);
    const csv = 'voltage,current\n0,9.9\n100,9.8\n200,nine\n';
    const res = await tech.post(`/api/checks/${created.body.id}/iv-trace`).set('x-csrf-token', tech.csrf).attach('file', Buffer.from(csv), 'bad.csv').expect(400);
    expect(errorOf(res).message).toMatch(/^Line 4:/);
    await dispatcher.get(`/api/checks/${created.body.id}/iv-trace`).expect(404);
  });
});
