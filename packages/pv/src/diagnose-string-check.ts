import { assertModuleSpec } from './assert-module-spec.ts';
import { assertNumber } from './assert-number.ts';
import { DEFAULT_TOLERANCES, type StringCheckTolerances } from './default-tolerances.ts';
import { ENGINE_VERSION } from './engine-version.ts';
import { expectedString } from './expected-string.ts';
import { formatNumber } from './format-number.ts';
import { median } from './median.ts';
import type { CurvePoints, ModuleSpec } from './types.ts';

/** Finding codes of {@link diagnoseStringCheck}; the API and the web app branch on them. */
export const FINDING_CODES = [
  'REVERSE_POLARITY',
  'OPEN_CIRCUIT',
  'MODULES_MISSING_OR_SHORTED',
  'SUBSTRINGS_BYPASSED',
  'VOLTAGE_LOW',
  'VOLTAGE_HIGH',
  'LOW_CURRENT',
  'CURRENT_HIGH',
  'CONDITIONS_TOO_POOR',
  'PEERS_AGREE_DATASHEET_DISAGREES',
] as const;
/** One of {@link FINDING_CODES}. */
export type FindingCode = (typeof FINDING_CODES)[number];

/** One finding: what the reading points to, how sure the engine is, one sentence for the technician. */
export type Finding = {
  readonly code: FindingCode;
  /** `fail` findings fail the check; `attention` findings need a look or a repeat. */
  readonly severity: 'fail' | 'attention';
  /** 0 … 1. */
  readonly confidence: number;
  /** One plain sentence with numbers and units. */
  readonly message: string;
  /** Numbers behind the message (units in the keys). */
  readonly detail: Readonly<Record<string, number | string | boolean>>;
};

/** Input of {@link diagnoseStringCheck}. */
export type StringCheckInput = {
  readonly module: ModuleSpec;
  readonly modulesInSeries: number;
  readonly measured: {
    /** Open-circuit voltage, V (negative when the polarity is reversed). */
    readonly vocV: number;
    /** Short-circuit current, A (≥ 0). */
    readonly iscA?: number;
    /** Plane-of-array irradiance at the time of the reading, W/m². */
    readonly irradianceWm2?: number;
    /** Module back-surface (cell) temperature, °C. */
    readonly moduleTempC?: number;
    /** Irradiance readings during the test, W/m², to judge stability (optional). */
    readonly irradianceSamplesWm2?: readonly number[];
  };
  /** Identical strings on the same inverter or MPPT, measured within minutes. */
  readonly peers?: readonly { readonly vocV: number; readonly iscA?: number }[];
  /** Overrides of DEFAULT_TOLERANCES.stringCheck. */
  readonly tolerance?: Partial<StringCheckTolerances>;
};

/** Result of {@link diagnoseStringCheck}. */
export type StringCheckResult = {
  readonly verdict: 'pass' | 'attention' | 'fail';
  /** Expected string values at the measured conditions, or null when no irradiance was recorded. */
  readonly expected: CurvePoints | null;
  /** (measured/expected − 1)·100 for Voc, %, or null when Voc could not be judged against the datasheet. */
  readonly vocDeviationPct: number | null;
  /** (measured/expected − 1)·100 for Isc, %, or null when Isc was not measured or could not be judged. */
  readonly iscDeviationPct: number | null;
  readonly findings: Finding[];
  /** Engine that produced the verdict. */
  readonly engineVersion: string;
};

const v1 = (x: number): string => `${formatNumber(x, 1)} V`;
const a2 = (x: number): string => `${formatNumber(x, 2)} A`;
const pct = (x: number): string => `${formatNumber(Math.abs(x), 1)} %`;
const clamp01 = (x: number): number => Math.min(1, Math.max(0, x));

/**
 * Judges one string's Voc (and Isc) reading against what it should read (pv-field-testing §3 and §7).
 *
 * Expected values come from {@link expectedString} at the measured irradiance and module
 * temperature; identical peer strings (median, when at least `minPeers`) are the preferred
 * reference for counting faults, as they cancel irradiance and temperature errors. Voc is judged
 * from 200 W/m² with a module temperature, Isc from 400 W/m², both only when the irradiance was
 * steady within ±2 % (defaults; configurable). Fault counting works on the voltage shortfall ΔV in
 * units of one substring (module Voc ÷ bypass diodes): a whole number of substrings within 0.3 of
 * one is bypassed substrings, a whole number of modules is missing or shorted modules (§7).
 * Findings: REVERSE_POLARITY, OPEN_CIRCUIT, MODULES_MISSING_OR_SHORTED, SUBSTRINGS_BYPASSED,
 * VOLTAGE_LOW, VOLTAGE_HIGH, LOW_CURRENT, CURRENT_HIGH, CONDITIONS_TOO_POOR,
 * PEERS_AGREE_DATASHEET_DISAGREES. The verdict is `fail` if any finding fails, `attention` if any
 * needs attention, else `pass`. Measured values are only as good as the instruments; local codes
 * rule. Throws a RangeError on invalid input (a failing string is a return value, not an error).
 */
export function diagnoseStringCheck(input: StringCheckInput): StringCheckResult {
  const { module, modulesInSeries: n, measured } = input;
  assertModuleSpec(module);
  assertNumber(n, 'modulesInSeries', { integer: true, min: 1, max: 1000 });
  assertNumber(measured.vocV, 'measured.vocV', { min: -5000, max: 5000 });
  if (measured.iscA !== undefined) assertNumber(measured.iscA, 'measured.iscA', { min: 0, max: 1000 });
  if (measured.irradianceWm2 !== undefined)
    assertNumber(measured.irradianceWm2, 'measured.irradianceWm2', { min: 0, max: 2000 });
  if (measured.moduleTempC !== undefined)
    assertNumber(measured.moduleTempC, 'measured.moduleTempC', { min: -60, max: 120 });
  for (const [k, g] of (measured.irradianceSamplesWm2 ?? []).entries())
    assertNumber(g, `measured.irradianceSamplesWm2[${k}]`, { min: 0, max: 2000 });
  const peers = input.peers ?? [];
  for (const [k, peer] of peers.entries()) {
    assertNumber(peer.vocV, `peers[${k}].vocV`, { min: -5000, max: 5000 });
    if (peer.iscA !== undefined) assertNumber(peer.iscA, `peers[${k}].iscA`, { min: 0, max: 1000 });
  }
  const tol: StringCheckTolerances = { ...DEFAULT_TOLERANCES.stringCheck, ...input.tolerance };
  const findings: Finding[] = [];
  const finish = (
    expected: CurvePoints | null,
    vocDeviationPct: number | null,
    iscDeviationPct: number | null,
  ): StringCheckResult => ({
    verdict: findings.some((f) => f.severity === 'fail')
      ? 'fail'
      : findings.length > 0
        ? 'attention'
        : 'pass',
    expected,
    vocDeviationPct,
    iscDeviationPct,
    findings,
    engineVersion: ENGINE_VERSION,
  });

  const g = measured.irradianceWm2;
  const t = measured.moduleTempC;
  const expected =
    g !== undefined && g > 0
      ? expectedString({ module, modulesInSeries: n, irradianceWm2: g, moduleTempC: t ?? 25 })
      : null;
  const stcVocV = n * module.vocV;
  const scaleVocV = expected?.vocV ?? stcVocV;
  const diodes = module.bypassDiodes;

  // Polarity and open circuit need no good conditions: the voltage is far from any expected value.
  if (measured.vocV < -tol.openCircuitVocFraction * scaleVocV) {
    const isWholeString = Math.abs(Math.abs(measured.vocV) / scaleVocV - 1) < 0.15;
    findings.push({
      code: 'REVERSE_POLARITY',
      severity: 'fail',
      confidence: isWholeString ? 0.95 : 0.8,
      message: `Voc reads ${v1(measured.vocV)}, so the string polarity is reversed: stop, do not connect the string or close its fuse or switch until the plus and minus conductors are swapped (check the meter leads first).`,
      detail: { measuredVocV: measured.vocV, expectedVocV: scaleVocV, isWholeString },
    });
    return finish(expected, null, null);
  }
  if (measured.vocV < tol.openCircuitVocFraction * scaleVocV) {
    findings.push({
      code: 'OPEN_CIRCUIT',
      severity: 'fail',
      confidence: 0.9,
      message: `Voc is ${v1(measured.vocV)} where about ${v1(scaleVocV)} is expected, so the string is open: check the string fuse, the connectors and the cable, measuring across each fuse and connector to find the break.`,
      detail: { measuredVocV: measured.vocV, expectedVocV: scaleVocV },
    });
    return finish(expected, null, null);
  }

  // Conditions.
  const samples = measured.irradianceSamplesWm2 ?? [];
  const sampleMean = samples.length > 0 ? samples.reduce((s, x) => s + x, 0) / samples.length : 0;
  const changePct =
    samples.length >= 2 && sampleMean > 0
      ? Math.max(...samples.map((x) => Math.abs(x / sampleMean - 1))) * 100
      : 0;
  const isSteady = changePct <= tol.maxIrradianceChangePct;
  const canJudgeVoc = g !== undefined && g >= tol.minIrradianceForVocWm2 && t !== undefined && isSteady;
  const canJudgeIsc = g !== undefined && g >= tol.minIrradianceForIscWm2 && isSteady;
  const needG = `${formatNumber(tol.minIrradianceForVocWm2, 0)} W/m² (${formatNumber(tol.minIrradianceForIscWm2, 0)} W/m² for Isc)`;
  let poorReason: string | null = null;
  if (!isSteady) {
    poorReason = `Irradiance changed by ±${formatNumber(changePct, 1)} % during the test (limit ±${formatNumber(tol.maxIrradianceChangePct, 1)} %), so repeat the reading under steady sun.`;
  } else if (g === undefined) {
    poorReason = `No irradiance was recorded, so the reading cannot be compared with the datasheet: measure plane-of-array irradiance with a reference cell at the same time, with at least ${needG}.`;
  } else if (g < tol.minIrradianceForVocWm2) {
    poorReason = `Irradiance was ${formatNumber(g, 0)} W/m², too low to judge this string, so repeat the test with at least ${needG} of steady sun on the module plane.`;
  } else if (t === undefined) {
    poorReason = `No module temperature was recorded, so Voc cannot be compared with the datasheet: measure the back-of-module temperature at the same time as the string.`;
  } else if (measured.iscA !== undefined && !canJudgeIsc) {
    poorReason = `Irradiance was ${formatNumber(g, 0)} W/m², enough to judge Voc but not Isc, so repeat the Isc test with at least ${formatNumber(tol.minIrradianceForIscWm2, 0)} W/m² of steady sun.`;
  }
  if (poorReason !== null) {
    findings.push({
      code: 'CONDITIONS_TOO_POOR',
      severity: 'attention',
      confidence: 1,
      message: poorReason,
      detail: {
        irradianceWm2: g ?? -1,
        hasModuleTemp: t !== undefined,
        irradianceChangePct: changePct,
        canJudgeVoc,
        canJudgeIsc,
      },
    });
  }

  // Voltage: reference for counting is the peer median when there are enough peers.
  const peerVocs = peers.map((p) => p.vocV).filter((x) => x > 0);
  const peerVocV = peerVocs.length >= tol.minPeers ? median(peerVocs) : null;
  const datasheetVocV = canJudgeVoc && expected !== null ? expected.vocV : null;
  const vocDeviationPct = datasheetVocV === null ? null : (measured.vocV / datasheetVocV - 1) * 100;
  if (peerVocV !== null && datasheetVocV !== null) {
    const peersOffPct = (peerVocV / datasheetVocV - 1) * 100;
    const agreesWithPeers = Math.abs(measured.vocV / peerVocV - 1) * 100 <= tol.peerPct;
    if (Math.abs(peersOffPct) > tol.vocPct && agreesWithPeers) {
      findings.push({
        code: 'PEERS_AGREE_DATASHEET_DISAGREES',
        severity: 'attention',
        confidence: 0.7,
        message: `Voc of ${v1(measured.vocV)} agrees with the ${peerVocs.length} other strings (median ${v1(peerVocV)}) but they are all ${pct(peersOffPct)} ${peersOffPct < 0 ? 'below' : 'above'} the ${v1(datasheetVocV)} the datasheet predicts, so check the module type, the module count in the records and the temperature probe.`,
        detail: {
          quantity: 'voc',
          measuredVocV: measured.vocV,
          peerMedianVocV: peerVocV,
          expectedVocV: datasheetVocV,
          peersDeviationPct: peersOffPct,
        },
      });
    }
  }
  const referenceVocV = peerVocV ?? datasheetVocV;
  const reference =
    peerVocV !== null
      ? `the ${v1(peerVocV)} median of the other strings`
      : `the ${v1(referenceVocV ?? 0)} expected`;
  let isVoltageFault = false;
  if (referenceVocV !== null) {
    const moduleVocV = referenceVocV / n;
    const substringVocV = moduleVocV / diodes;
    const shortfallV = referenceVocV - measured.vocV;
    const devPct = (measured.vocV / referenceVocV - 1) * 100;
    const trust = peerVocV !== null ? 1 : 0.85;
    const j = Math.round(shortfallV / substringVocV);
    const residualV = Math.abs(shortfallV - j * substringVocV);
    const detail = {
      measuredVocV: measured.vocV,
      referenceVocV,
      reference: peerVocV !== null ? 'peers' : 'datasheet',
      shortfallV,
      substringVocV,
      moduleVocV,
    };
    if (
      shortfallV > 0 &&
      j >= 1 &&
      j < n * diodes &&
      residualV <= tol.substringResidualFraction * substringVocV
    ) {
      isVoltageFault = true;
      const confidence = clamp01((1 - residualV / (0.5 * substringVocV)) * trust);
      const severity = confidence >= 0.5 ? 'fail' : 'attention';
      const head = `Voc is ${v1(shortfallV)} (${pct(devPct)}) below ${reference}`;
      if (j % diodes === 0) {
        const k = j / diodes;
        findings.push({
          code: 'MODULES_MISSING_OR_SHORTED',
          severity,
          confidence,
          message: `${head}: about ${k === 1 ? 'one module' : `${k} modules`} of ${v1(moduleVocV)} ${k === 1 ? 'is' : 'are'} missing or shorted${k === 2 ? ', or one module is connected in reverse' : ''} — check the module count and each module's Voc.`,
          detail: { ...detail, modules: k, substrings: j },
        });
      } else {
        findings.push({
          code: 'SUBSTRINGS_BYPASSED',
          severity,
          confidence,
          message: `${head}: about ${j === 1 ? 'one substring' : `${j} substrings`} of ${v1(substringVocV)} ${j === 1 ? 'is' : 'are'} bypassed — check the bypass diodes of each module.`,
          detail: { ...detail, substrings: j },
        });
      }
    } else if (shortfallV < 0) {
      const k = Math.round(-shortfallV / moduleVocV);
      const moduleResidualV = Math.abs(-shortfallV - k * moduleVocV);
      if (k >= 1 && moduleResidualV <= tol.moduleResidualFraction * moduleVocV) {
        isVoltageFault = true;
        findings.push({
          code: 'VOLTAGE_HIGH',
          severity: 'fail',
          confidence: clamp01((1 - moduleResidualV / (0.5 * moduleVocV)) * trust),
          message: `Voc is ${v1(-shortfallV)} (${pct(devPct)}) above ${reference}: the string seems to have ${k === 1 ? 'one module' : `${k} modules`} more than the ${n} documented — count the modules and check the inverter's maximum DC voltage.`,
          detail: { ...detail, extraModules: k },
        });
      } else if (devPct > tol.vocPct) {
        isVoltageFault = true;
        findings.push({
          code: 'VOLTAGE_HIGH',
          severity: 'fail',
          confidence: 0.6 * trust,
          message: `Voc is ${v1(-shortfallV)} (${pct(devPct)}) above ${reference} and not a whole number of modules, so check the datasheet in the records and the temperature reading.`,
          detail,
        });
      }
    } else if (-devPct > tol.vocPct) {
      isVoltageFault = true;
      findings.push({
        code: 'VOLTAGE_LOW',
        severity: 'fail',
        confidence: 0.6 * trust,
        message: `Voc is ${v1(shortfallV)} (${pct(devPct)}) below ${reference} and not a whole number of substrings, so look for a damaged or reversed module, PID or water ingress, and re-check the temperature reading.`,
        detail,
      });
    }
  }

  // Current.
  let iscDeviationPct: number | null = null;
  if (measured.iscA !== undefined && expected !== null) {
    if (measured.iscA < tol.openCircuitIscFraction * expected.iscA) {
      findings.push({
        code: 'OPEN_CIRCUIT',
        severity: 'fail',
        confidence: 0.85,
        message: `Isc is ${a2(measured.iscA)} while Voc is ${v1(measured.vocV)}, so the current path is open: check the string fuse, the isolator and the test leads of the short-circuit test.`,
        detail: { measuredIscA: measured.iscA, expectedIscA: expected.iscA, measuredVocV: measured.vocV },
      });
    } else if (canJudgeIsc) {
      iscDeviationPct = (measured.iscA / expected.iscA - 1) * 100;
      const peerIscs = peers.flatMap((p) => (p.iscA === undefined ? [] : [p.iscA]));
      const peerIscA = peerIscs.length >= tol.minPeers ? median(peerIscs) : null;
      if (peerIscA !== null) {
        const peersOffPct = (peerIscA / expected.iscA - 1) * 100;
        if (
          Math.abs(peersOffPct) > tol.iscPct &&
          Math.abs(measured.iscA / peerIscA - 1) * 100 <= tol.peerPct
        ) {
          findings.push({
            code: 'PEERS_AGREE_DATASHEET_DISAGREES',
            severity: 'attention',
            confidence: 0.7,
            message: `Isc of ${a2(measured.iscA)} agrees with the ${peerIscs.length} other strings (median ${a2(peerIscA)}) but they are all ${pct(peersOffPct)} ${peersOffPct < 0 ? 'below' : 'above'} the ${a2(expected.iscA)} expected at ${formatNumber(g ?? 0, 0)} W/m², so check the irradiance sensor's position, tilt and calibration.`,
            detail: {
              quantity: 'isc',
              measuredIscA: measured.iscA,
              peerMedianIscA: peerIscA,
              expectedIscA: expected.iscA,
              peersDeviationPct: peersOffPct,
            },
          });
        }
      }
      const referenceIscA = peerIscA ?? expected.iscA;
      const against =
        peerIscA !== null
          ? `the ${a2(peerIscA)} median of the other strings`
          : `the ${a2(expected.iscA)} expected`;
      const devPct = (measured.iscA / referenceIscA - 1) * 100;
      const trust = peerIscA !== null ? 1 : 0.8;
      if (-devPct > (peerIscA !== null ? tol.peerPct : tol.iscPct)) {
        findings.push({
          code: 'LOW_CURRENT',
          severity: 'fail',
          confidence: clamp01((-devPct / (2 * tol.iscPct)) * trust),
          message: isVoltageFault
            ? `Isc is ${a2(measured.iscA)}, ${pct(devPct)} below ${against}, and Voc is off too, so re-check the irradiance and temperature readings and the meter before judging the modules.`
            : `Isc is ${a2(measured.iscA)}, ${pct(devPct)} below ${against} while Voc is normal, so look for soiling, shading or degraded modules and check that the irradiance sensor sits in the module plane.`,
          detail: {
            measuredIscA: measured.iscA,
            referenceIscA,
            reference: peerIscA !== null ? 'peers' : 'datasheet',
            deviationPct: devPct,
          },
        });
      } else if (devPct > (peerIscA !== null ? tol.peerPct : tol.iscPct)) {
        findings.push({
          code: 'CURRENT_HIGH',
          severity: 'attention',
          confidence: clamp01((devPct / (2 * tol.iscPct)) * trust),
          message: `Isc is ${a2(measured.iscA)}, ${pct(devPct)} above ${against}, so check that the irradiance sensor sits in the module plane and that only this string is on the meter.`,
          detail: {
            measuredIscA: measured.iscA,
            referenceIscA,
            reference: peerIscA !== null ? 'peers' : 'datasheet',
            deviationPct: devPct,
          },
        });
      }
    }
  }
  return finish(expected, vocDeviationPct, iscDeviationPct);
}
