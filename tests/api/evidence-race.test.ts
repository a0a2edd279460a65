import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { simulateString } from '@stringfield/pv';
import { DiodeReplacement, IvTrace, Photo, StringCheck, ThermalFinding, User, WorkOrder, sequelize } from '../../apps/api/src/models/index.ts';
import { apiTestEnv } from './test-env.ts';
import { demoEmail, errorOf, resetDatabase, signIn, someoneWaits, type Agent } from './helpers.ts';

// Evidence that reaches the server while the ticket is leaving the field (the technician hands it in, the
// supervisor signs it off) must either be in before the status changes or be refused. Saved beside a
// sign-off that never saw it, it would be evidence the signed digest does not cover.

let dispatcher: Agent;
let tech: Agent;
let siteId: number;
let techId: number;

async function ticketInField(): Promise<{ id: number; stringId: number }> {
  const strings = (await dispatcher.get(`/api/sites/${siteId}/strings?q=INV03-MPPT1`).expect(200)).body.items as Array<{ id: number }>;
  const created = await dispatcher
    .post('/api/work-orders')
    .set('x-csrf-token', dispatcher.csrf)
    .send({ siteId, strings: [{ stringId: strings[0]!.id, symptom: 'low voltage' }], faultCategory: 'bypass_diode_failure', priority: 'P3', title: 'Race check', source: 'inspection', assigneeId: techId })
    .expect(201);
  const id = created.body.items[0].id as number;
  const { version } = (await tech.get(`/api/work-orders/${id}`).expect(200)).body as { version: number };
  await tech.post(`/api/work-orders/${id}/transitions`).set('x-csrf-token', tech.csrf).send({ to: 'in_field', version }).expect(200);
  return { id, stringId: strings[0]!.id };
}

/**
 * Holds the ticket row as a status change does, sends `write`, waits until it is stuck behind the lock, moves
 * the ticket out of the field and commits; then returns what the write got back.
 */
async function writeWhileLeavingField(ticketId: number, write: () => PromiseLike<{ status: number; body: unknown }>) {
  const t = await sequelize.transaction();
  await WorkOrder.findByPk(ticketId, { transaction: t, lock: t.LOCK.UPDATE });
  const pending = Promise.resolve(write());
  // The evidence write's lock on the ticket, or (without it) its insert's foreign key check.
  await someoneWaits(t, /work_orders|INSERT INTO `(string_checks|diode_replacements|photos|thermal_findings|iv_traces)`/);
  await WorkOrder.update({ status: 'awaiting_signoff' }, { where: { id: ticketId }, transaction: t });
  await t.commit();
  return pending;
}

beforeAll(async () => {
  await resetDatabase({ plant: true });
  [dispatcher, tech] = await Promise.all([signIn(demoEmail.dispatcher), signIn(demoEmail.technician)]);
  siteId = (await dispatcher.get('/api/sites?q=CBD').expect(200)).body.items[0].id;
  techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
});

describe('evidence racing a ticket out of the field', () => {
  it('refuses a check that was waiting on the ticket when it was handed in, and saves nothing', async () => {
    const { id, stringId } = await ticketInField();
    const res = await writeWhileLeavingField(id, () =>
      tech
        .post(`/api/work-orders/${id}/checks`)
        .set('x-csrf-token', tech.csrf)
        .send({ clientId: randomUUID(), stringId, phase: 'after', takenAt: new Date().toISOString(), vocV: 700, iscA: 10.3, irradianceWm2: 1000, irradianceMethod: 'reference_cell', moduleTempC: 25, moduleTempMethod: 'back_sensor', polarityCorrect: true }),
    );
    expect(res.status).toBe(409);
    expect(errorOf(res).message).toMatch(/not in the field/);
    expect(await StringCheck.count({ where: { workOrderId: id } })).toBe(0);
  });

  it('refuses a diode replacement that was waiting on the ticket when it was handed in, and saves nothing', async () => {
    const { id, stringId } = await ticketInField();
    const res = await writeWhileLeavingField(id, () =>
      tech
        .post(`/api/work-orders/${id}/diode-replacements`)
        .set('x-csrf-token', tech.csrf)
        .send({ stringId, modulePosition: 2, diodePosition: 1, failureMode: 'short', foundBy: 'voc_deficit', installedPart: { partNumber: 'SBD-15A45V', ratingA: 15, ratingV: 45, type: 'schottky' } }),
    );
    expect(res.status).toBe(409);
    expect(errorOf(res).message).toMatch(/now, so nothing was added/);
    expect(await DiodeReplacement.count({ where: { workOrderId: id } })).toBe(0);
  });

  it('refuses a photo that was waiting on the ticket when it was handed in, and leaves no file behind', async () => {
    const { id, stringId } = await ticketInField();
    const folder = path.join(apiTestEnv.UPLOADS_DIR, 'photos', String(id));
    const img = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#4a7' } }).jpeg().toBuffer();
    const res = await writeWhileLeavingField(id, () =>
      tech.post(`/api/work-orders/${id}/photos`).set('x-csrf-token', tech.csrf).field('meta', JSON.stringify([{ tag: 'after', stringId }])).attach('files', img, 'after.jpg'),
    );
    expect(res.status).toBe(409);
    expect(await Photo.count({ where: { workOrderId: id } })).toBe(0);
    // The files are written before the ticket is locked; a refusal removes them.
    expect(fs.existsSync(folder) ? fs.readdirSync(folder) : []).toEqual([]);
  });

  it('refuses a thermal finding that was waiting on the ticket when it was handed in, and saves nothing', async () => {
    const { id, stringId } = await ticketInField();
    const img = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#a74' } }).jpeg().toBuffer();
    const uploaded = await tech
      .post(`/api/work-orders/${id}/photos`)
      .set('x-csrf-token', tech.csrf)
      .field('meta', JSON.stringify([{ tag: 'thermal', stringId }]))
      .attach('files', img, 'thermal.jpg')
      .expect(201);
    const photoId = (uploaded.body.items as Array<{ id: number }>)[0]!.id;
    const res = await writeWhileLeavingField(id, () =>
      tech
        .put(`/api/photos/${photoId}/thermal`)
        .set('x-csrf-token', tech.csrf)
        .send({ hottestC: 71, referenceC: 43, irradianceWm2: 850, pattern: 'junction_box', modulePosition: 4 }),
    );
    expect(res.status).toBe(409);
    expect(errorOf(res).message).toMatch(/now, so nothing was added/);
    expect(await ThermalFinding.count({ where: { photoId } })).toBe(0);
  });

  it('refuses an I-V trace that was waiting on the ticket when it was handed in, and saves nothing', async () => {
    const { id, stringId } = await ticketInField();
    const check = await tech
      .post(`/api/work-orders/${id}/checks`)
      .set('x-csrf-token', tech.csrf)
      .send({ clientId: randomUUID(), stringId, phase: 'before', takenAt: new Date().toISOString(), vocV: 690, iscA: 9.2, irradianceWm2: 900, irradianceMethod: 'reference_cell', moduleTempC: 40, moduleTempMethod: 'back_sensor', polarityCorrect: true })
      .expect(201);
    // A generated trace (marked as such): simulateString of an 18-module string of the demo's 330 W module.
    const sim = simulateString({
      module: { pmaxW: 330, vocV: 40.6, iscA: 10.3, vmpV: 33.8, impA: 9.77, alphaIscPctPerC: 0.05, betaVocPctPerC: -0.3, gammaPmaxPctPerC: -0.38, cellsInSeries: 60, bypassDiodes: 3, noctC: 45 },
      modulesInSeries: 18,
      irradianceWm2: 900,
      moduleTempC: 40,
      points: 120,
    });
    const rows = sim.curve.filter((p) => p.voltageV >= 0 && p.currentA >= 0).map((p) => `${p.voltageV.toFixed(3)},${p.currentA.toFixed(3)}`);
    const csv = `# generated by simulateString for tests\nvoltage,current\n${rows.join('\n')}\n`;
    const res = await writeWhileLeavingField(id, () =>
      tech.post(`/api/checks/${check.body.id}/iv-trace`).set('x-csrf-token', tech.csrf).attach('file', Buffer.from(csv), 'trace.csv'),
    );
    expect(res.status).toBe(409);
    expect(await IvTrace.count({ where: { checkId: check.body.id } })).toBe(0);
  });
});
