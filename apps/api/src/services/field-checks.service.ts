import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import {
  ENGINE_VERSION,
  diagnoseStringCheck,
  insulationResistanceRequirement,
  type StringCheckResult,
} from '@stringfield/pv';
import type { CheckFinding, SessionUser, StringCheck as StringCheckDto, StringCheckInput } from '@stringfield/shared';
import { AppError, notFound } from '../lib/app-error.ts';
import { Instrument, Inverter, IvTrace, ModuleModel, PvString, StringCheck, User, WorkOrder, WorkOrderString, sequelize } from '../models/index.ts';
import { visibleSiteIds } from './site-access.ts';

/** Checks of other strings taken this close to a check (either side) count as its peers. */
export const PEER_WINDOW_MS = 15 * 60_000;

export type Peer = { stringLabel: string; vocV: number; iscA: number | null; takenAt: string };
type PeerCandidate = Pick<StringCheck, 'stringId' | 'vocV' | 'iscA' | 'takenAt'>;

function parseJson<T>(raw: string | null, fallback: T): T {
  if (!raw) return fallback;
  try {
    return JSON.parse(raw) as T;
  } catch {
    return fallback;
  }
}

async function toDtos(rows: StringCheck[]): Promise<StringCheckDto[]> {
  if (rows.length === 0) return [];
  const [users, strings, tickets, traces] = await Promise.all([
    User.findAll({ where: { id: [...new Set(rows.map((r) => r.technicianId))] }, attributes: ['id', 'name'] }),
    PvString.findAll({ where: { id: [...new Set(rows.map((r) => r.stringId))] }, attributes: ['id', 'label'] }),
    WorkOrder.findAll({ where: { id: [...new Set(rows.map((r) => r.workOrderId))] }, attributes: ['id', 'number'] }),
    IvTrace.findAll({ where: { checkId: rows.map((r) => r.id) }, attributes: ['checkId'] }),
  ]);
  const userName = new Map(users.map((u) => [u.id, u.name]));
  const label = new Map(strings.map((s) => [s.id, s.label]));
  const number = new Map(tickets.map((t) => [t.id, t.number]));
  const withTrace = new Set(traces.map((t) => t.checkId));
  return rows.map((r) => ({
    id: r.id,
    clientId: r.clientId,
    workOrderId: r.workOrderId,
    workOrderNumber: number.get(r.workOrderId) ?? '',
    stringId: r.stringId,
    stringLabel: label.get(r.stringId) ?? '',
    phase: r.phase,
    takenAt: r.takenAt.toISOString(),
    technician: { id: r.technicianId, name: userName.get(r.technicianId) ?? '' },
    vocV: r.vocV,
    iscA: r.iscA,
    operatingCurrentA: r.operatingCurrentA,
    operatingVoltageV: r.operatingVoltageV,
    irradianceWm2: r.irradianceWm2,
    irradianceMethod: r.irradianceMethod as StringCheckDto['irradianceMethod'],
    moduleTempC: r.moduleTempC,
    moduleTempMethod: r.moduleTempMethod as StringCheckDto['moduleTempMethod'],
    ambientC: r.ambientC,
    polarityCorrect: r.polarityCorrect,
    insulationPlusMOhm: r.insulationPlusMOhm,
    insulationMinusMOhm: r.insulationMinusMOhm,
    insulationTestVoltageV: r.insulationTestVoltageV,
    instrumentIds: r.instrumentIds ? r.instrumentIds.split(',').map(Number) : [],
    notes: r.notes,
    expected: parseJson(r.expectedJson, null),
    vocDeviationPct: r.vocDeviationPct,
    iscDeviationPct: r.iscDeviationPct,
    verdict: r.verdict,
    findings: parseJson<CheckFinding[]>(r.findingsJson, []),
    peers: parseJson<Peer[]>(r.peersJson, []),
    isCalibrationOverdue: r.isCalibrationOverdue,
    engineVersion: r.engineVersion,
    supersedesId: r.supersedesId,
    supersededById: r.supersededById ?? null,
    hasIvTrace: withTrace.has(r.id),
    createdAt: r.createdAt.toISOString(),
  }));
}

/** Latest current checks of the other strings on the same inverter input, within 15 minutes of this one. */
async function peersOf(s: PvString, takenAt: Date, transaction?: Transaction): Promise<Peer[]> {
  const neighbours = await PvString.findAll({
    where: {
      inverterId: s.inverterId,
      mpptInput: s.mpptInput,
      moduleModelId: s.moduleModelId,
      modulesInSeries: s.modulesInSeries,
      id: { [Op.ne]: s.id },
    },
    attributes: ['id', 'label'],
    transaction,
  });
  if (neighbours.length === 0) return [];
  const checks = await StringCheck.findAll({
    where: {
      stringId: neighbours.map((n) => n.id),
      supersededById: null,
      takenAt: { [Op.between]: [new Date(takenAt.getTime() - PEER_WINDOW_MS), new Date(takenAt.getTime() + PEER_WINDOW_MS)] },
    },
    order: [['takenAt', 'DESC']],
    transaction,
  });
  return latestPeers(checks, new Map(neighbours.map((n) => [n.id, n.label])));
}

/** The latest check of each neighbouring string, from current checks inside the peer window, newest first. */
export function latestPeers(newestFirst: PeerCandidate[], labelOf: Map<number, string>): Peer[] {
  const latest = new Map<number, PeerCandidate>();
  for (const c of newestFirst) if (!latest.has(c.stringId)) latest.set(c.stringId, c);
  return [...latest.values()].map((c) => ({ stringLabel: labelOf.get(c.stringId)!, vocV: c.vocV, iscA: c.iscA, takenAt: c.takenAt.toISOString() }));
}

type Judgement = {
  result: StringCheckResult;
  findings: CheckFinding[];
  verdict: 'pass' | 'attention' | 'fail';
  isCalibrationOverdue: boolean;
};

/** The engine's verdict plus the checks that need data the engine does not hold: insulation, polarity flag, calibration. */
function judge(input: StringCheckInput, module: ModuleModel, modulesInSeries: number, peers: Peer[], instruments: Instrument[]): Judgement {
  const result = diagnoseStringCheck({
    module: module.toSpec(),
    modulesInSeries,
    measured: {
      vocV: input.vocV,
      ...(input.iscA !== undefined ? { iscA: input.iscA } : {}),
      ...(input.irradianceWm2 !== undefined ? { irradianceWm2: input.irradianceWm2 } : {}),
      ...(input.moduleTempC !== undefined ? { moduleTempC: input.moduleTempC } : {}),
    },
    ...(peers.length ? { peers: peers.map((p) => ({ vocV: p.vocV, ...(p.iscA !== null ? { iscA: p.iscA } : {}) })) } : {}),
  });
  const findings: CheckFinding[] = result.findings.map((f) => ({ ...f, detail: { ...f.detail } }));

  if (!input.polarityCorrect && !findings.some((f) => f.code === 'REVERSE_POLARITY')) {
    findings.push({
      code: 'REVERSE_POLARITY',
      severity: 'fail',
      confidence: 1,
      message: 'Polarity was recorded as wrong: stop, do not connect the string or close its fuse or switch until the wiring is corrected.',
      detail: { recordedByTechnician: true },
    });
  }

  const insulation = [input.insulationPlusMOhm, input.insulationMinusMOhm].filter((v): v is number => v !== undefined);
  if (insulation.length) {
    // IEC 62446: the system voltage for the test is 1.25 × Voc at STC of the string.
    const systemV = 1.25 * module.vocV * modulesInSeries;
    const req = insulationResistanceRequirement(systemV);
    const lowest = Math.min(...insulation);
    if (lowest < req.minResistanceMOhm) {
      findings.push({
        code: 'INSULATION_LOW',
        severity: 'fail',
        confidence: 0.9,
        message: `Insulation resistance ${lowest} MΩ is below the ${req.minResistanceMOhm} MΩ minimum for a ${Math.round(systemV)} V system: suspect a ground fault; keep the string isolated.`,
        detail: { lowestMOhm: lowest, minimumMOhm: req.minResistanceMOhm, systemVoltageV: Math.round(systemV), edition: req.edition },
      });
    }
    if (input.insulationTestVoltageV !== undefined && input.insulationTestVoltageV < req.testVoltageV) {
      findings.push({
        code: 'INSULATION_TEST_VOLTAGE_LOW',
        severity: 'attention',
        confidence: 1,
        message: `The insulation test ran at ${input.insulationTestVoltageV} V; a ${Math.round(systemV)} V system is tested at ${req.testVoltageV} V. Repeat at the right voltage.`,
        detail: { usedV: input.insulationTestVoltageV, requiredV: req.testVoltageV },
      });
    }
  }

  const day = input.takenAt.slice(0, 10);
  const overdue = instruments.filter((i) => i.calibrationDueOn < day);
  for (const i of overdue) {
    findings.push({
      code: 'INSTRUMENT_CALIBRATION_OVERDUE',
      severity: 'attention',
      confidence: 1,
      message: `Instrument ${i.serial} was due for calibration on ${i.calibrationDueOn}; the reading is kept but flagged.`,
      detail: { instrumentId: i.id, serial: i.serial, calibrationDueOn: i.calibrationDueOn },
    });
  }
  const verdict = findings.some((f) => f.severity === 'fail') ? 'fail' : findings.some((f) => f.severity === 'attention') || result.verdict === 'attention' ? 'attention' : result.verdict;
  return { result, findings, verdict, isCalibrationOverdue: overdue.length > 0 };
}

/**
 * The row a check is stored as: the reading as given plus what the engine made of it, judged against the
 * peers and instruments passed in. Pure, so the demo seed stores exactly what the API would have.
 */
export function checkRow(args: {
  input: StringCheckInput;
  workOrderId: number;
  technicianId: number;
  string: Pick<PvString, 'id' | 'modulesInSeries'>;
  module: ModuleModel;
  peers: Peer[];
  instruments: Instrument[];
  supersedesId: number | null;
}): CreationAttributes<StringCheck> {
  const { input, peers } = args;
  const j = judge(input, args.module, args.string.modulesInSeries, peers, args.instruments);
  return {
    clientId: input.clientId,
    workOrderId: args.workOrderId,
    stringId: args.string.id,
    technicianId: args.technicianId,
    phase: input.phase,
    takenAt: new Date(input.takenAt),
    vocV: input.vocV,
    iscA: input.iscA ?? null,
    operatingCurrentA: input.operatingCurrentA ?? null,
    operatingVoltageV: input.operatingVoltageV ?? null,
    irradianceWm2: input.irradianceWm2 ?? null,
    irradianceMethod: input.irradianceMethod ?? null,
    moduleTempC: input.moduleTempC ?? null,
    moduleTempMethod: input.moduleTempMethod ?? null,
    ambientC: input.ambientC ?? null,
    polarityCorrect: input.polarityCorrect,
    insulationPlusMOhm: input.insulationPlusMOhm ?? null,
    insulationMinusMOhm: input.insulationMinusMOhm ?? null,
    insulationTestVoltageV: input.insulationTestVoltageV ?? null,
    instrumentIds: input.instrumentIds.join(','),
    notes: input.notes,
    expectedJson: j.result.expected ? JSON.stringify(j.result.expected) : null,
    vocDeviationPct: j.result.vocDeviationPct,
    iscDeviationPct: j.result.iscDeviationPct,
    verdict: j.verdict,
    findingsJson: JSON.stringify(j.findings),
    peersJson: JSON.stringify(peers),
    isCalibrationOverdue: j.isCalibrationOverdue,
    engineVersion: ENGINE_VERSION,
    supersedesId: args.supersedesId,
  };
}

/** The ticket a check is written to, under a shared lock so it cannot leave the field until the check commits. */
async function ticketForWork(user: SessionUser, workOrderId: number, transaction: Transaction): Promise<WorkOrder> {
  const wo = await WorkOrder.findByPk(workOrderId, { transaction, lock: transaction.LOCK.SHARE });
  if (!wo) throw notFound('That work order');
  if (wo.assigneeId !== user.id) throw new AppError('FORBIDDEN', `Only the technician assigned to ${wo.number} records its checks.`);
  if (wo.status !== 'in_field') {
    throw new AppError('CONFLICT', `${wo.number} is not in the field right now; start the work first (or it was returned, reassigned or closed meanwhile).`, undefined, {
      status: wo.status,
    });
  }
  return wo;
}

async function saveCheck(user: SessionUser, wo: WorkOrder, input: StringCheckInput, supersedes: StringCheck | null, transaction: Transaction) {
  const onTicket = await WorkOrderString.findOne({ where: { workOrderId: wo.id, stringId: input.stringId }, transaction });
  if (!onTicket) throw new AppError('VALIDATION_FAILED', `That string is not on ${wo.number}.`, { stringId: 'Not a string of this ticket' });
  const s = (await PvString.findByPk(input.stringId, { include: [{ model: ModuleModel, as: 'moduleModel' }], transaction }))!;
  const instruments = input.instrumentIds.length ? await Instrument.findAll({ where: { id: input.instrumentIds }, transaction }) : [];
  if (instruments.length !== new Set(input.instrumentIds).size) {
    throw new AppError('VALIDATION_FAILED', 'An instrument is not in the register.', { instrumentIds: 'Unknown instrument' });
  }
  const peers = await peersOf(s, new Date(input.takenAt), transaction);
  const created = await StringCheck.create(
    checkRow({ input, workOrderId: wo.id, technicianId: user.id, string: s, module: s.moduleModel!, peers, instruments, supersedesId: supersedes?.id ?? null }),
    { transaction },
  );
  if (supersedes) await supersedes.update({ supersededById: created.id }, { transaction });
  return created;
}

/**
 * Record a check. The client's id makes the request idempotent: sending the same check twice (a retry,
 * an offline queue flushing) returns the first one and creates nothing.
 */
export async function recordCheck(user: SessionUser, workOrderId: number, input: StringCheckInput): Promise<{ check: StringCheckDto; isNew: boolean }> {
  const existing = await StringCheck.findOne({ where: { clientId: input.clientId } });
  if (existing) {
    if (existing.workOrderId !== workOrderId || existing.technicianId !== user.id) {
      throw new AppError('CONFLICT', 'That client id belongs to another check.');
    }
    return { check: (await toDtos([existing]))[0]!, isNew: false };
  }
  const created = await sequelize.transaction(async (transaction) => {
    const wo = await ticketForWork(user, workOrderId, transaction);
    return saveCheck(user, wo, input, null, transaction);
  });
  return { check: (await toDtos([created]))[0]!, isNew: true };
}

/** Correct a saved check: a new revision supersedes it; both are kept. */
export async function reviseCheck(user: SessionUser, checkId: number, input: StringCheckInput): Promise<StringCheckDto> {
  const existing = await StringCheck.findOne({ where: { clientId: input.clientId } });
  if (existing) {
    if (existing.supersedesId !== checkId) throw new AppError('CONFLICT', 'That client id belongs to another check.');
    return (await toDtos([existing]))[0]!;
  }
  const created = await sequelize.transaction(async (transaction) => {
    // The ticket first, then the check: the order every evidence write takes its locks in.
    const ticketOf = await StringCheck.findByPk(checkId, { attributes: ['id', 'workOrderId'], transaction });
    if (!ticketOf) throw notFound('That check');
    const wo = await ticketForWork(user, ticketOf.workOrderId, transaction);
    const old = await StringCheck.findByPk(checkId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!old) throw notFound('That check');
    if (old.supersededById) throw new AppError('CONFLICT', 'That check was already corrected; correct the latest revision instead.');
    if (old.stringId !== input.stringId) {
      throw new AppError('VALIDATION_FAILED', 'A correction is for the same string.', { stringId: 'Same string as the original' });
    }
    return saveCheck(user, wo, input, old, transaction);
  });
  return (await toDtos([created]))[0]!;
}

async function assertTicketVisible(user: SessionUser, workOrderId: number): Promise<WorkOrder> {
  const wo = await WorkOrder.findByPk(workOrderId);
  if (!wo) throw notFound('That work order');
  if (user.role === 'owner') {
    const ids = (await visibleSiteIds(user)) ?? [];
    if (!ids.includes(wo.siteId) || wo.status !== 'signed_off') throw notFound('That work order');
  }
  return wo;
}

export async function listTicketChecks(user: SessionUser, workOrderId: number, includeSuperseded: boolean): Promise<StringCheckDto[]> {
  await assertTicketVisible(user, workOrderId);
  const rows = await StringCheck.findAll({
    where: { workOrderId, ...(includeSuperseded ? {} : { supersededById: null }) },
    order: [['takenAt', 'ASC'], ['id', 'ASC']],
  });
  return toDtos(rows);
}

export async function listStringChecks(user: SessionUser, stringId: number): Promise<StringCheckDto[]> {
  const s = await PvString.findByPk(stringId, { include: [{ model: Inverter, as: 'inverter', attributes: ['siteId'] }] });
  if (!s) throw notFound('That string');
  let where = {};
  if (user.role === 'owner') {
    const ids = (await visibleSiteIds(user)) ?? [];
    if (!ids.includes(s.siteId)) throw notFound('That string');
    const signed = await WorkOrder.findAll({ where: { siteId: s.siteId, status: 'signed_off' }, attributes: ['id'] });
    where = { workOrderId: signed.map((w) => w.id) };
  }
  const rows = await StringCheck.findAll({ where: { stringId, supersededById: null, ...where }, order: [['takenAt', 'DESC']], limit: 200 });
  return toDtos(rows);
}

export async function getCheckForTrace(user: SessionUser, checkId: number): Promise<StringCheck> {
  const c = await StringCheck.findByPk(checkId);
  if (!c) throw notFound('That check');
  await assertTicketVisible(user, c.workOrderId);
  return c;
}
