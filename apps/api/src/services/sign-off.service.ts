import { Op, type Transaction } from 'sequelize';
import {
  workOrderStatusLabels,
  type Gate,
  type GatesResponse,
  type SessionUser,
  type SignOffInput,
  type SignOffRecord,
  type VerifyResponse,
} from '@stringfield/shared';
import { AppError, notFound } from '../lib/app-error.ts';
import { canonicalJson, sha256 } from '../lib/canonical-json.ts';
import { queueMail } from '../lib/mailer.ts';
import { closeOutMail } from '../lib/mail-templates.ts';
import {
  DiodeReplacement,
  Photo,
  PvString,
  Site,
  SignOff,
  StringCheck,
  User,
  WorkOrder,
  WorkOrderEvent,
  WorkOrderString,
  sequelize,
} from '../models/index.ts';
import { missingOf, visibleTicket } from './evidence.service.ts';

type Override = { stringId: number; reason: string };

async function ticketStrings(workOrderId: number, transaction?: Transaction) {
  const links = await WorkOrderString.findAll({ where: { workOrderId }, transaction });
  const strings = await PvString.findAll({ where: { id: links.map((l) => l.stringId) }, attributes: ['id', 'label'], order: [['label', 'ASC']], transaction });
  return strings;
}

/** The evidence gates of sign-off, each with what is missing; overrides only ever lift the after-check gate. */
export async function evaluateGates(wo: WorkOrder, overrides: Override[] = [], transaction?: Transaction): Promise<GatesResponse> {
  const strings = await ticketStrings(wo.id, transaction);
  const [checks, photos, diodes] = await Promise.all([
    StringCheck.findAll({ where: { workOrderId: wo.id, phase: 'after', supersededById: null }, order: [['takenAt', 'ASC']], transaction }),
    Photo.findAll({ where: { workOrderId: wo.id, tag: 'after' }, attributes: ['stringId'], transaction }),
    DiodeReplacement.findAll({ where: { workOrderId: wo.id }, transaction }),
  ]);
  const latestAfter = new Map<number, StringCheck>();
  for (const c of checks) latestAfter.set(c.stringId, c);
  const overridden = new Map(overrides.filter((o) => o.reason.trim().length >= 20).map((o) => [o.stringId, o.reason]));

  const afterCheck: Gate = { code: 'AFTER_CHECK_PASS', label: 'Every string has an after-repair check that passes', ok: true, missing: [] };
  for (const s of strings) {
    const c = latestAfter.get(s.id);
    if (c?.verdict === 'pass' || overridden.has(s.id)) continue;
    afterCheck.missing.push({
      message: c ? `${s.label}: the after check is "${c.verdict}", not "pass"` : `${s.label}: no after-repair check yet`,
      stringId: s.id,
      overridable: Boolean(c),
    });
  }
  const photoStrings = new Set(photos.map((p) => p.stringId));
  const afterPhoto: Gate = {
    code: 'AFTER_PHOTO',
    label: 'At least one after-repair photo per string',
    ok: true,
    missing: strings.filter((s) => !photoStrings.has(s.id)).map((s) => ({ message: `${s.label}: no after photo`, stringId: s.id, overridable: false })),
  };
  const labelOf = new Map(strings.map((s) => [s.id, s.label]));
  const diodeGate: Gate = {
    code: 'DIODE_RECORDS_COMPLETE',
    label: 'Every bypass-diode replacement record is complete',
    ok: true,
    missing: diodes
      .map((d) => ({ d, missing: missingOf(d) }))
      .filter((x) => x.missing.length > 0)
      .map(({ d, missing }) => ({
        message: `${labelOf.get(d.stringId) ?? 'String'} module ${d.modulePosition}, diode ${d.diodePosition}: missing ${missing.join(', ')}`,
        stringId: d.stringId,
        overridable: false,
      })),
  };
  const gates: Gate[] = [afterCheck, afterPhoto, diodeGate];
  if (wo.faultCategory === 'insulation_ground_fault') {
    gates.push({
      code: 'INSULATION_RECORDED',
      label: 'Insulation resistance recorded after the repair (insulation / ground fault)',
      ok: true,
      missing: strings
        .filter((s) => {
          const c = latestAfter.get(s.id);
          return !c || (c.insulationPlusMOhm === null && c.insulationMinusMOhm === null);
        })
        .map((s) => ({ message: `${s.label}: no insulation reading on the after check`, stringId: s.id, overridable: false })),
    });
  }
  gates.push({
    code: 'NO_PENDING_OFFLINE_ITEMS',
    label: 'Nothing is still waiting on the technician’s phone',
    ok: true,
    missing: wo.pendingOfflineCount > 0 ? [{ message: `${wo.pendingOfflineCount} item(s) saved offline have not reached the server yet`, stringId: null, overridable: false }] : [],
  });
  for (const g of gates) g.ok = g.missing.length === 0;
  return { ok: gates.every((g) => g.ok), gates };
}

export async function getGates(user: SessionUser, workOrderId: number): Promise<GatesResponse> {
  const wo = await visibleTicket(user, workOrderId);
  return evaluateGates(wo);
}

/** The canonical snapshot of a ticket's evidence that the sign-off digest covers. */
export async function evidenceSnapshot(workOrderId: number, lastEventId?: number, transaction?: Transaction) {
  const wo = (await WorkOrder.findByPk(workOrderId, { transaction }))!;
  const [strings, checks, photos, diodes, events] = await Promise.all([
    WorkOrderString.findAll({ where: { workOrderId }, transaction }),
    StringCheck.findAll({ where: { workOrderId }, order: [['id', 'ASC']], transaction }),
    Photo.findAll({ where: { workOrderId }, order: [['id', 'ASC']], transaction }),
    DiodeReplacement.findAll({ where: { workOrderId }, order: [['id', 'ASC']], transaction }),
    WorkOrderEvent.findAll({ where: { workOrderId, ...(lastEventId ? { id: { [Op.lte]: lastEventId } } : {}) }, order: [['id', 'ASC']], transaction }),
  ]);
  return {
    ticket: { number: wo.number, siteId: wo.siteId, faultCategory: wo.faultCategory, priority: wo.priority, title: wo.title, reportedAt: wo.reportedAt },
    strings: strings.map((s) => ({ stringId: s.stringId, symptom: s.symptom })).sort((a, b) => a.stringId - b.stringId),
    checks: checks.map((c) => {
      const { createdAt: _c, updatedAt: _u, ...rest } = c.get({ plain: true });
      return rest;
    }),
    photos: photos.map((p) => ({ id: p.id, sha256: p.sha256, tag: p.tag, stringId: p.stringId, modulePosition: p.modulePosition, capturedAt: p.capturedAt })),
    diodeReplacements: diodes.map((d) => {
      const { createdAt: _c, updatedAt: _u, ...rest } = d.get({ plain: true });
      return rest;
    }),
    events: events.map((e) => ({ id: e.id, type: e.type, actorId: e.actorId, fromStatus: e.fromStatus, toStatus: e.toStatus, changes: e.changes, comment: e.comment, createdAt: e.createdAt })),
  };
}

/** Sign a ticket off: gates first (409 with the list), then the record with the digest, then the owner is told. */
export async function signOffWorkOrder(user: SessionUser, workOrderId: number, input: SignOffInput): Promise<SignOffRecord> {
  if (user.role !== 'supervisor') throw new AppError('FORBIDDEN', 'Only a supervisor signs a ticket off.');
  const wo = await visibleTicket(user, workOrderId);
  if (wo.status !== 'awaiting_signoff') {
    throw new AppError('CONFLICT', `${wo.number} is ${workOrderStatusLabels[wo.status]}; only a ticket awaiting sign-off can be signed off.`, undefined, { status: wo.status });
  }
  if (wo.version !== input.version) throw new AppError('CONFLICT', `${wo.number} changed while you were reviewing it. Reload and check the evidence again.`, undefined, { status: wo.status });
  const site = (await Site.findByPk(wo.siteId))!;
  // The close-out mail is queued in the sign-off's transaction: both are recorded, or neither.
  await sequelize.transaction(async (transaction) => {
    const signOff = await recordSignOff(wo, user.id, input, new Date(), transaction);
    await queueMail(
      closeOutMail(site.ownerContactEmail, { id: wo.id, number: wo.number, title: wo.title, siteName: site.name, dueAt: wo.dueAt, priority: wo.priority }, user.name, signOff.digest),
      transaction,
    );
  });
  return (await getSignOff(user, wo.id))!;
}

/**
 * The sign-off of a ticket awaiting it, inside `transaction`: the gates (409 with the checklist while evidence
 * is missing), the status change, the transition event, and the record with the digest of the evidence up
 * to that event. The API signs off now; the demo seed signs its history off at the time the history gives.
 */
export async function recordSignOff(
  wo: WorkOrder,
  supervisorId: number,
  input: Pick<SignOffInput, 'comment' | 'overrides'>,
  at: Date,
  transaction: Transaction,
): Promise<SignOff> {
  // The row locked first: evidence writes hold it shared, so the gates below see every piece that committed
  // and none can be added until the sign-off is in.
  const locked = await WorkOrder.findByPk(wo.id, { attributes: ['id', 'status', 'version'], transaction, lock: transaction.LOCK.UPDATE });
  if (!locked || locked.status !== 'awaiting_signoff' || locked.version !== wo.version) {
    throw new AppError('CONFLICT', `${wo.number} changed while you were reviewing it. Reload and check again.`, undefined, { status: locked?.status ?? null });
  }
  const gates = await evaluateGates(wo, input.overrides, transaction);
  if (!gates.ok) {
    throw new AppError('CONFLICT', 'The evidence is not complete yet; see the checklist.', undefined, { gates: gates.gates });
  }
  const strings = await ticketStrings(wo.id, transaction);
  const labelOf = new Map(strings.map((s) => [s.id, s.label]));
  const usedOverrides = input.overrides.filter((o) => labelOf.has(o.stringId));
  const [affected] = await WorkOrder.update(
    { status: 'signed_off', signedOffAt: at, version: wo.version + 1 },
    { where: { id: wo.id, version: wo.version, status: 'awaiting_signoff' }, transaction },
  );
  if (affected === 0) throw new AppError('CONFLICT', `${wo.number} changed while you were reviewing it. Reload and check again.`);
  const event = await WorkOrderEvent.create(
    {
      workOrderId: wo.id,
      actorId: supervisorId,
      type: 'transition',
      fromStatus: 'awaiting_signoff',
      toStatus: 'signed_off',
      changes: usedOverrides.length ? JSON.stringify({ overrides: { from: null, to: usedOverrides.map((o) => labelOf.get(o.stringId)) } }) : null,
      comment: input.comment || null,
      createdAt: at,
    },
    { transaction },
  );
  const text = canonicalJson(await evidenceSnapshot(wo.id, event.id, transaction));
  return SignOff.create(
    {
      workOrderId: wo.id,
      supervisorId,
      signedAt: at,
      comment: input.comment,
      overridesJson: JSON.stringify(usedOverrides.map((o) => ({ ...o, stringLabel: labelOf.get(o.stringId)! }))),
      digest: sha256(text),
      snapshotJson: text,
      lastEventId: event.id,
    },
    { transaction },
  );
}

export async function getSignOff(user: SessionUser, workOrderId: number): Promise<SignOffRecord | null> {
  await visibleTicket(user, workOrderId);
  const s = await SignOff.findByPk(workOrderId);
  if (!s) return null;
  const supervisor = await User.findByPk(s.supervisorId, { attributes: ['id', 'name'] });
  return {
    workOrderId,
    supervisor: { id: s.supervisorId, name: supervisor?.name ?? '' },
    signedAt: s.signedAt.toISOString(),
    comment: s.comment,
    digest: s.digest,
    overrides: JSON.parse(s.overridesJson) as SignOffRecord['overrides'],
  };
}

/** Recompute the digest from what the database holds now; any change to the evidence shows as a mismatch. */
export async function verifySignOff(user: SessionUser, workOrderId: number): Promise<VerifyResponse> {
  await visibleTicket(user, workOrderId);
  const s = await SignOff.findByPk(workOrderId);
  if (!s) throw notFound('A sign-off of that work order');
  const computed = sha256(canonicalJson(await evidenceSnapshot(workOrderId, s.lastEventId)));
  return { matches: computed === s.digest, storedDigest: s.digest, computedDigest: computed, checkedAt: new Date().toISOString() };
}

/** The technician's phone reports how many items for this ticket are still queued offline. */
export async function reportOfflineQueue(user: SessionUser, workOrderId: number, pending: number): Promise<{ pending: number }> {
  const wo = await WorkOrder.findByPk(workOrderId);
  if (!wo) throw notFound('That work order');
  if (wo.assigneeId !== user.id) throw new AppError('FORBIDDEN', 'Only the assigned technician’s device reports its queue.');
  await wo.update({ pendingOfflineCount: pending });
  return { pending };
}
