import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import { beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { PDFParse } from 'pdf-parse';
import { SignOff, sequelize, User } from '../../apps/api/src/models/index.ts';
import { demoEmail, errorOf, resetDatabase, signIn, waitForMail, type Agent } from './helpers.ts';

let dispatcher: Agent;
let tech: Agent;
let supervisor: Agent;
let owner: Agent;
let otherOwner: Agent;
let ticketId: number;
let strings: Array<{ id: number; label: string }>;
let diodeId: number;

const stcVocV = 18 * 40.6; // demo SDM-330-60P × 18 on CBD

async function version() {
  return (await supervisor.get(`/api/work-orders/${ticketId}`).expect(200)).body.version as number;
}
const move = async (agent: Agent, to: string, extra: Record<string, unknown> = {}) =>
  agent.post(`/api/work-orders/${ticketId}/transitions`).set('x-csrf-token', agent.csrf).send({ to, version: await version(), ...extra }).expect(200);
const afterCheck = (stringId: number, vocV: number) =>
  tech
    .post(`/api/work-orders/${ticketId}/checks`)
    .set('x-csrf-token', tech.csrf)
    .send({ clientId: randomUUID(), stringId, phase: 'after', takenAt: new Date().toISOString(), vocV, iscA: 10.3, irradianceWm2: 1000, irradianceMethod: 'reference_cell', moduleTempC: 25, moduleTempMethod: 'back_sensor', polarityCorrect: true })
    .expect(201);
const photo = async (stringId: number, tag = 'after') => {
  const img = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#4a7' } }).jpeg().toBuffer();
  const res = await tech.post(`/api/work-orders/${ticketId}/photos`).set('x-csrf-token', tech.csrf).field('meta', JSON.stringify([{ tag, stringId }])).attach('files', img, 'p.jpg').expect(201);
  return res.body.items[0].id as number;
};

beforeAll(async () => {
  await resetDatabase({ plant: true });
  [dispatcher, tech, supervisor, owner, otherOwner] = await Promise.all([
    signIn(demoEmail.dispatcher),
    signIn(demoEmail.technician),
    signIn(demoEmail.supervisor),
    signIn(demoEmail.otherOwner),
    signIn(demoEmail.owner),
  ]);
  const sites = await dispatcher.get('/api/sites?q=CBD').expect(200);
  const siteId = sites.body.items[0].id as number;
  strings = (await dispatcher.get(`/api/sites/${siteId}/strings?q=INV07-MPPT2`).expect(200)).body.items;
  const techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  const created = await dispatcher
    .post('/api/work-orders')
    .set('x-csrf-token', dispatcher.csrf)
    .send({ siteId, strings: strings.map((s) => ({ stringId: s.id, symptom: 'one substring short' })), faultCategory: 'bypass_diode_failure', priority: 'P2', title: 'Diode short on INV07 input 2', source: 'monitoring_alert', assigneeId: techId })
    .expect(201);
  ticketId = created.body.items[0].id;
  await move(tech, 'in_field');
  await afterCheck(strings[0]!.id, stcVocV); // passes
  await afterCheck(strings[1]!.id, stcVocV - 40.6 / 3); // still one substring short
  await photo(strings[0]!.id);
  const d = await tech
    .post(`/api/work-orders/${ticketId}/diode-replacements`)
    .set('x-csrf-token', tech.csrf)
    .send({ stringId: strings[1]!.id, modulePosition: 4, diodePosition: 1, failureMode: 'short', foundBy: 'voc_deficit', installedPart: { partNumber: 'SBD-15A45V', ratingA: 15, ratingV: 45, type: 'schottky' } })
    .expect(201);
  diodeId = d.body.id;
  await move(tech, 'awaiting_signoff');
});

describe('sign-off gates', () => {
  it('lists what is missing, string by string, before the supervisor presses anything', async () => {
    const res = await supervisor.get(`/api/work-orders/${ticketId}/sign-off-gates`).expect(200);
    expect(res.body.ok).toBe(false);
    const gate = (code: string) => res.body.gates.find((g: { code: string }) => g.code === code);
    expect(gate('AFTER_CHECK_PASS').missing).toEqual([expect.objectContaining({ stringId: strings[1]!.id, overridable: true })]);
    expect(gate('AFTER_PHOTO').missing.map((m: { stringId: number }) => m.stringId)).toEqual([strings[1]!.id]);
    expect(gate('DIODE_RECORDS_COMPLETE').ok).toBe(false);
    expect(gate('NO_PENDING_OFFLINE_ITEMS').ok).toBe(true);
    expect(gate('INSULATION_RECORDED')).toBeUndefined(); // only for insulation / ground faults
  });

  it('refuses sign-off with 409 and the failing gates, and refuses anyone but a supervisor', async () => {
    const res = await supervisor.post(`/api/work-orders/${ticketId}/sign-off`).set('x-csrf-token', supervisor.csrf).send({ version: await version() }).expect(409);
    expect(res.body.gates.filter((g: { ok: boolean }) => !g.ok).map((g: { code: string }) => g.code).sort()).toEqual(['AFTER_CHECK_PASS', 'AFTER_PHOTO', 'DIODE_RECORDS_COMPLETE']);
    await dispatcher.post(`/api/work-orders/${ticketId}/sign-off`).set('x-csrf-token', dispatcher.csrf).send({ version: await version() }).expect(403);
  });

  it('refuses an override reason shorter than 20 characters', async () => {
    const res = await supervisor
      .post(`/api/work-orders/${ticketId}/sign-off`)
      .set('x-csrf-token', supervisor.csrf)
      .send({ version: await version(), overrides: [{ stringId: strings[1]!.id, reason: 'looks fine' }] })
      .expect(400);
    expect(errorOf(res).fields?.['overrides.0.reason']).toMatch(/20 characters/);
  });

  it('counts items still queued on the technician’s phone as a failing gate', async () => {
    // The ticket goes back to the field for the missing evidence.
    await move(supervisor, 'returned', { reason: 'After photo and diode record details missing' });
    await move(tech, 'in_field');
    await tech.put(`/api/work-orders/${ticketId}/offline-queue`).set('x-csrf-token', tech.csrf).send({ pending: 2 }).expect(200);
    const res = await supervisor.get(`/api/work-orders/${ticketId}/sign-off-gates`).expect(200);
    expect(res.body.gates.find((g: { code: string }) => g.code === 'NO_PENDING_OFFLINE_ITEMS').ok).toBe(false);
    await tech.put(`/api/work-orders/${ticketId}/offline-queue`).set('x-csrf-token', tech.csrf).send({ pending: 0 }).expect(200);
  });
});

describe('signing off', () => {
  let digest: string;

  it('signs off with an override once the rest is complete, records a SHA-256 digest and mails the owner contact', async () => {
    const before = await photo(strings[1]!.id, 'before');
    const after = await photo(strings[1]!.id);
    await tech
      .put(`/api/diode-replacements/${diodeId}`)
      .set('x-csrf-token', tech.csrf)
      .send({
        stringId: strings[1]!.id, modulePosition: 4, diodePosition: 1, failureMode: 'short', foundBy: 'voc_deficit', moduleSerial: 'SDM330-19-55120',
        removedPart: { partNumber: 'SBD-15A45V', ratingA: 15, ratingV: 45, type: 'schottky' }, installedPart: { partNumber: 'SBD-15A45V', ratingA: 15, ratingV: 45, type: 'schottky' },
        newDiodeForwardV: 0.41, vocBeforeV: 27.1, vocAfterV: 40.5, beforePhotoId: before, afterPhotoId: after,
      })
      .expect(200);
    await move(tech, 'awaiting_signoff');
    const body = { comment: 'Diode replaced on module 4.', overrides: [{ stringId: strings[1]!.id, reason: 'Second substring of module 9 is shaded by a vent; tracked separately.' }] };
    // The owner's close-out mail is queued with the sign-off: if it cannot be queued (here the outbox is
    // not there), the ticket is not signed off either — no sign-off the owner never hears of.
    await sequelize.query('RENAME TABLE mail_outbox TO mail_outbox_away');
    try {
      await supervisor.post(`/api/work-orders/${ticketId}/sign-off`).set('x-csrf-token', supervisor.csrf).send({ version: await version(), ...body }).expect(500);
    } finally {
      await sequelize.query('RENAME TABLE mail_outbox_away TO mail_outbox');
    }
    expect((await supervisor.get(`/api/work-orders/${ticketId}`).expect(200)).body.status).toBe('awaiting_signoff');
    expect(await SignOff.count({ where: { workOrderId: ticketId } })).toBe(0);
    const since = Date.now() - 5;
    const res = await supervisor
      .post(`/api/work-orders/${ticketId}/sign-off`)
      .set('x-csrf-token', supervisor.csrf)
      .send({ version: await version(), ...body })
      .expect(201);
    expect(res.body.digest).toMatch(/^[0-9a-f]{64}$/);
    expect(res.body.overrides).toEqual([expect.objectContaining({ stringLabel: strings[1]!.label })]);
    digest = res.body.digest;
    const detail = await supervisor.get(`/api/work-orders/${ticketId}`).expect(200);
    expect(detail.body.status).toBe('signed_off');
    const mail = await waitForMail('calder.owner@stringfield.test', /signed off: close-out report/, since);
    expect(mail.text).toContain(digest);
    expect(mail.text).toContain(`/api/work-orders/${ticketId}/report.pdf`);
  });

  it('refuses any new evidence on a signed-off ticket (409)', async () => {
    const res = await tech
      .post(`/api/work-orders/${ticketId}/checks`)
      .set('x-csrf-token', tech.csrf)
      .send({ clientId: randomUUID(), stringId: strings[0]!.id, phase: 'after', takenAt: new Date().toISOString(), vocV: stcVocV, polarityCorrect: true })
      .expect(409);
    expect(errorOf(res).message).toMatch(/not in the field/);
    await tech.put(`/api/diode-replacements/${diodeId}`).set('x-csrf-token', tech.csrf).send({}).expect(400);
  });

  it('verifies the digest, and shows a mismatch once a stored check is changed in the database', async () => {
    const ok = await owner.get(`/api/work-orders/${ticketId}/sign-off/verify`).expect(200);
    expect(ok.body).toMatchObject({ matches: true, storedDigest: digest, computedDigest: digest });
    // A comment after sign-off is not evidence and does not change the digest.
    await supervisor.post(`/api/work-orders/${ticketId}/comments`).set('x-csrf-token', supervisor.csrf).send({ body: 'Report sent.' }).expect(201);
    expect((await owner.get(`/api/work-orders/${ticketId}/sign-off/verify`).expect(200)).body.matches).toBe(true);
    await sequelize.query('UPDATE string_checks SET voc_v = voc_v + 5 WHERE work_order_id = ? AND string_id = ?', { replacements: [ticketId, strings[0]!.id] });
    const tampered = await owner.get(`/api/work-orders/${ticketId}/sign-off/verify`).expect(200);
    expect(tampered.body.matches).toBe(false);
    expect(tampered.body.computedDigest).not.toBe(digest);
    await sequelize.query('UPDATE string_checks SET voc_v = voc_v - 5 WHERE work_order_id = ? AND string_id = ?', { replacements: [ticketId, strings[0]!.id] });
  });

  it('produces a close-out PDF with the right numbers, for the owner of the site only', async () => {
    const res = await owner.get(`/api/work-orders/${ticketId}/report.pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    // Kept for a person to look at (pdftoppm renders it); .data/ is git-ignored.
    await fs.mkdir('.data/reports', { recursive: true });
    await fs.writeFile('.data/reports/close-out-sample.pdf', res.body as Buffer);
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    const detail = await supervisor.get(`/api/work-orders/${ticketId}`).expect(200);
    expect(text).toContain(detail.body.number);
    expect(text).toContain(strings[0]!.label);
    expect(text).toContain(`${stcVocV.toFixed(1)} V`); // expected Voc at STC, 18 × 40.6 V
    expect(text).toContain(`${(stcVocV - 40.6 / 3).toFixed(1)} V`); // the measured reading one substring short
    expect(text).toContain('Signed off by Demo Supervisor');
    expect(text).toMatch(/Override for/);
    expect(text).toContain(digest.slice(0, 32));
    expect(text).toMatch(/field measurements subject to the accuracy/);
    await otherOwner.get(`/api/work-orders/${ticketId}/report.pdf`).expect(404);
  });
});
