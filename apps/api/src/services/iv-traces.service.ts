import { analyzeCurve, simulateString, translateToStc, type IvPoint } from '@stringfield/pv';
import type { IvTrace as IvTraceDto, SessionUser } from '@stringfield/shared';
import { AppError, notFound } from '../lib/app-error.ts';
import { IvTrace, ModuleModel, PvString, StringCheck, WorkOrder, sequelize } from '../models/index.ts';
import { holdInField } from './evidence.service.ts';
import { getCheckForTrace } from './field-checks.service.ts';

export type ParsedTrace = { points: IvPoint[]; irradianceWm2: number | null; cellTempC: number | null };

const metaPatterns = {
  irradianceWm2: /^\s*#?\s*(irradiance|poa|g)\b[^:;=,\t]*[:;=,\t]\s*(-?\d+(?:[.,]\d+)?)/i,
  cellTempC: /^\s*#?\s*(module temp\w*|cell temp\w*|temperature|temp|t)\b[^:;=,\t]*[:;=,\t]\s*(-?\d+(?:[.,]\d+)?)/i,
};

function toNumber(text: string, decimalComma: boolean): number {
  const t = text.trim().replace(/^"|"$/g, '');
  const normal = decimalComma ? t.replace(',', '.') : t;
  return /^-?\d+(\.\d+)?([eE][-+]?\d+)?$/.test(normal) ? Number(normal) : Number.NaN;
}

/**
 * Read an I-V trace exported by a tracer: optional "irradiance: 812" / "temperature: 45" lines before a
 * header row naming the voltage and current columns, then one point per line. Commas, semicolons or
 * tabs separate columns; with semicolons or tabs a decimal comma is accepted. Errors name the line.
 */
export function parseIvCsv(buffer: Buffer): ParsedTrace {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer).replace(/^\uFEFF/, '');
  } catch {
    throw new AppError('VALIDATION_FAILED', 'The I-V file is not UTF-8 text. Export it again as CSV.');
  }
  const lines = text.split(/\r?\n/);
  let irradianceWm2: number | null = null;
  let cellTempC: number | null = null;
  let vCol = -1;
  let iCol = -1;
  let delimiter = ',';
  const points: IvPoint[] = [];
  for (const [index, raw] of lines.entries()) {
    const lineNo = index + 1;
    const line = raw.trim();
    if (!line) continue;
    if (vCol < 0) {
      const g = metaPatterns.irradianceWm2.exec(line);
      if (g) {
        irradianceWm2 = toNumber(g[2]!, true);
        continue;
      }
      const t = metaPatterns.cellTempC.exec(line);
      if (t && !/volt|curr/i.test(line)) {
        cellTempC = toNumber(t[2]!, true);
        continue;
      }
      delimiter = line.includes(';') ? ';' : line.includes('\t') ? '\t' : ',';
      const cells = line.split(delimiter).map((c) => c.trim().toLowerCase().replace(/^"|"$/g, ''));
      vCol = cells.findIndex((c) => /^(v|u|volt|voltage|v\s*\(v\)|voltage\s*\(v\)|voltage_v|v_v)/.test(c));
      iCol = cells.findIndex((c) => /^(i|current|amp|i\s*\(a\)|current\s*\(a\)|current_a|i_a)/.test(c));
      if (line.startsWith('#')) {
        vCol = -1;
        continue;
      }
      if (vCol < 0 || iCol < 0) {
        throw new AppError('VALIDATION_FAILED', `Line ${lineNo}: expected a header naming the voltage and current columns (for example "voltage,current").`);
      }
      continue;
    }
    const cells = line.split(delimiter);
    const v = toNumber(cells[vCol] ?? '', delimiter !== ',');
    const i = toNumber(cells[iCol] ?? '', delimiter !== ',');
    if (!Number.isFinite(v) || !Number.isFinite(i)) {
      throw new AppError('VALIDATION_FAILED', `Line ${lineNo}: "${line.slice(0, 60)}" does not hold a voltage and a current as numbers.`);
    }
    if (v < -5 || v > 1600 || i < -1 || i > 100) {
      throw new AppError('VALIDATION_FAILED', `Line ${lineNo}: ${v} V, ${i} A is outside what a PV string can show.`);
    }
    points.push({ voltageV: v, currentA: i });
  }
  if (vCol < 0) throw new AppError('VALIDATION_FAILED', 'The file has no header row naming the voltage and current columns.');
  if (points.length < 10) throw new AppError('VALIDATION_FAILED', `The trace has ${points.length} points; at least 10 are needed.`);
  if (points.length > 20_000) throw new AppError('VALIDATION_FAILED', 'The trace has more than 20,000 points.');
  points.sort((a, b) => a.voltageV - b.voltageV);
  return { points, irradianceWm2, cellTempC };
}

/** Voltage of a curve at a given current, by linear interpolation (curve sorted by voltage, current falling). */
function voltageAt(curve: readonly IvPoint[], currentA: number): number {
  for (let k = 1; k < curve.length; k += 1) {
    const a = curve[k - 1]!;
    const b = curve[k]!;
    if ((a.currentA - currentA) * (b.currentA - currentA) <= 0 && a.currentA !== b.currentA) {
      return a.voltageV + ((currentA - a.currentA) * (b.voltageV - a.voltageV)) / (b.currentA - a.currentA);
    }
  }
  return curve.at(-1)?.voltageV ?? 0;
}

/**
 * How many substrings a bypass step stands for: at the current of the step's top corner, the healthy
 * string (modelled at the same G and T) has a higher voltage; the shortfall counted in substrings of
 * that voltage is the number of bypassed substrings (pv-field-testing §9.3, common practice).
 */
function bypassedAtStep(
  step: { atV: number; atA: number } | undefined,
  module: Parameters<typeof simulateString>[0]['module'],
  modulesInSeries: number,
  irradianceWm2: number,
  cellTempC: number,
): number {
  if (!step) return 0;
  const healthy = simulateString({ module, modulesInSeries, irradianceWm2, moduleTempC: cellTempC, points: 200 });
  const healthyV = voltageAt(healthy.curve, step.atA);
  const substringV = healthyV / (modulesInSeries * module.bypassDiodes);
  return Math.max(1, Math.round((healthyV - step.atV) / substringV));
}

function toDto(t: IvTrace): IvTraceDto {
  const analysis = JSON.parse(t.analysisJson) as { measured: IvTraceDto['analysis']; stc: IvTraceDto['stcAnalysis']; translation: IvTraceDto['translation'] };
  return {
    checkId: t.checkId,
    fileName: t.fileName,
    irradianceWm2: t.irradianceWm2,
    cellTempC: t.cellTempC,
    points: JSON.parse(t.pointsJson) as IvPoint[],
    stcPoints: JSON.parse(t.stcPointsJson) as IvPoint[],
    analysis: analysis.measured,
    stcAnalysis: analysis.stc,
    translation: analysis.translation,
  };
}

/** Attach a tracer's CSV to a check: analyse it, translate it to STC (IEC 60891 procedure 1) and keep both. */
export async function attachIvTrace(user: SessionUser, checkId: number, fileName: string, buffer: Buffer): Promise<IvTraceDto> {
  const check = await StringCheck.findByPk(checkId);
  if (!check) throw notFound('That check');
  const wo = await WorkOrder.findByPk(check.workOrderId);
  if (!wo || wo.assigneeId !== user.id) throw new AppError('FORBIDDEN', 'Only the technician assigned to the ticket adds its I-V traces.');
  if (wo.status !== 'in_field') throw new AppError('CONFLICT', `${wo.number} is not in the field; traces are added while the work is under way.`);
  const parsed = parseIvCsv(buffer);
  const irradianceWm2 = parsed.irradianceWm2 ?? check.irradianceWm2;
  const cellTempC = parsed.cellTempC ?? check.moduleTempC;
  if (!irradianceWm2 || irradianceWm2 <= 0 || cellTempC === null) {
    throw new AppError('VALIDATION_FAILED', 'The trace needs the irradiance and module temperature: put them in the file or in the check.');
  }
  const s = (await PvString.findByPk(check.stringId, { include: [{ model: ModuleModel, as: 'moduleModel' }] }))!;
  const module = s.moduleModel!.toSpec();
  const measured = analyzeCurve(parsed.points);
  const likelyBypassedSubstrings = bypassedAtStep(measured.steps[0], module, s.modulesInSeries, irradianceWm2, cellTempC);
  const translated = translateToStc({ curve: parsed.points, irradianceWm2, cellTempC, module, modulesInSeries: s.modulesInSeries, procedure: 1 });
  const stc = analyzeCurve(translated.curve);
  const analysis = {
    measured: {
      iscA: measured.iscA,
      vocV: measured.vocV,
      pmpW: measured.pmpW,
      vmpV: measured.vmpV,
      impA: measured.impA,
      fillFactor: measured.fillFactor,
      seriesOhmEstimate: Number.isFinite(measured.seriesOhmEstimate) ? measured.seriesOhmEstimate : null,
      shuntOhmEstimate: Number.isFinite(measured.shuntOhmEstimate) ? measured.shuntOhmEstimate : null,
      steps: measured.steps.map((x) => ({ atV: x.atV, atA: x.atA })),
      likelyBypassedSubstrings,
    },
    stc: { iscA: stc.iscA, vocV: stc.vocV, pmpW: stc.pmpW, fillFactor: stc.fillFactor },
    translation: {
      procedure: translated.procedure,
      seriesOhm: translated.seriesOhm,
      kappaOhmPerC: translated.kappaOhmPerC,
      isApproximate: translated.isApproximate,
    },
  };
  const [row] = await sequelize.transaction(async (transaction) => {
    await holdInField(wo.id, transaction);
    return IvTrace.upsert(
      {
    checkId,
    fileName: fileName.slice(0, 255),
    irradianceWm2,
    cellTempC,
    pointsJson: JSON.stringify(parsed.points),
    stcPointsJson: JSON.stringify(translated.curve),
        analysisJson: JSON.stringify(analysis),
      },
      { transaction },
    );
  });
  return toDto(row);
}

export async function getIvTrace(user: SessionUser, checkId: number): Promise<IvTraceDto> {
  await getCheckForTrace(user, checkId);
  const t = await IvTrace.findByPk(checkId);
  if (!t) throw notFound('The I-V trace of that check');
  return toDto(t);
}
