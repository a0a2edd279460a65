import { assertNumber } from './assert-number.ts';
import { fitPolynomial } from './fit-polynomial.ts';
import { maximizeScalar } from './maximize-scalar.ts';
import type { IvPoint } from './types.ts';

/** A bypass-diode step (knee) found in an I-V curve. */
export type CurveStep = {
  /** Voltage at the top corner of the drop, V. */
  readonly atV: number;
  /** Current at the top corner of the drop, A. */
  readonly atA: number;
  /** Current lost across the drop, A. */
  readonly dropA: number;
};

/** Options of {@link analyzeCurve}. */
export type AnalyzeCurveOptions = {
  /** a = n·Ns·k·T/q of the measured device, V; when given, Rs is corrected for the diode term (Rs ≈ R_oc − a/Isc). */
  readonly modifiedIdealityV?: number;
  /** Smallest current drop that counts as a step, fraction of Isc (default 0.05, pv-field-testing §9.3, common practice). */
  readonly stepMinDropFraction?: number;
  /** Expected open-circuit voltage of one substring (cell-string behind one bypass diode), V; the smallest plateau that counts is half of it (pv-field-testing §9.3). */
  readonly substringVocV?: number;
};

/** Result of {@link analyzeCurve}. */
export type CurveAnalysis = {
  /** Short-circuit current, A (line through the 3 points nearest V = 0, ASTM E1036 practice). */
  readonly iscA: number;
  /** Open-circuit voltage, V (line through the 3 points nearest I = 0, ASTM E1036 practice). */
  readonly vocV: number;
  /** Maximum power, W (4th-order fit of P(V) over 0.75–1.15·Vmp, ASTM E1036 practice, when it agrees with the sampled maximum). */
  readonly pmpW: number;
  /** Voltage at maximum power, V. */
  readonly vmpV: number;
  /** Current at maximum power (Pmp/Vmp), A. */
  readonly impA: number;
  /** Pmp/(Voc·Isc), dimensionless. */
  readonly fillFactor: number;
  /** R_oc = −dV/dI at I = 0, Ω (quadratic fit over I ≤ 0.1·Isc). */
  readonly rocOhm: number;
  /** R_sc = −dV/dI at V = 0, Ω (quadratic fit over V ≤ 0.2·Voc). */
  readonly rscOhm: number;
  /** Series resistance estimate, Ω: R_oc − a/Isc when `modifiedIdealityV` is given, otherwise R_oc (an upper bound). */
  readonly seriesOhmEstimate: number;
  /** Shunt resistance estimate, Ω: R_sc (≈ Rsh + Rs). */
  readonly shuntOhmEstimate: number;
  /** Bypass-diode steps before the main knee, voltage ascending. */
  readonly steps: CurveStep[];
};

/**
 * Metrics of a measured or simulated I-V curve (pv-field-testing §9): Isc, Voc, Pmp, Vmp, Imp and
 * fill factor after ASTM E1036 practice; R_oc and R_sc slopes and the Rs/Rsh estimates of §9.2;
 * and bypass-diode steps (§9.3): on a uniform voltage grid, the normalised slope −dI/dV·Voc/Isc
 * (lightly median-filtered) rises above 1 in a drop and falls back below 1 (and below half the
 * drop's peak slope) on the plateau that follows; a drop counts as a step when it loses ≥ 5 % of
 * Isc and is followed by a plateau at least half a substring Voc wide (0.5 % of Voc when the
 * substring Voc is not given) before the main knee (thresholds common practice, configurable).
 * A trace needs several points per substring width.
 * Accepts points in any order (sorted by voltage). Throws a RangeError with fewer than 8 points,
 * non-finite values, or a curve that does not span from near Isc to near Voc.
 */
export function analyzeCurve(curve: readonly IvPoint[], options: AnalyzeCurveOptions = {}): CurveAnalysis {
  if (curve.length < 8) throw new RangeError(`analyzeCurve needs at least 8 points, got ${curve.length}`);
  for (const [k, p] of curve.entries()) {
    assertNumber(p.voltageV, `curve[${k}].voltageV`);
    assertNumber(p.currentA, `curve[${k}].currentA`);
  }
  const points = [...curve].sort((p, q) => p.voltageV - q.voltageV);
  const vs = points.map((p) => p.voltageV);
  const is = points.map((p) => p.currentA);
  const n = points.length;

  const head = fitPolynomial(vs.slice(0, 3), is.slice(0, 3), 1);
  const iscA = head[0] ?? 0;
  const tail = fitPolynomial(is.slice(n - 3), vs.slice(n - 3), 1);
  const vocV = tail[0] ?? 0;
  if (!(iscA > 0) || !(vocV > 0))
    throw new RangeError('analyzeCurve: the curve must run from near Isc (> 0 A) to near Voc (> 0 V)');

  // Maximum power.
  let best = 0;
  for (let k = 1; k < n; k += 1)
    if ((vs[k] ?? 0) * (is[k] ?? 0) > (vs[best] ?? 0) * (is[best] ?? 0)) best = k;
  let vmpV = vs[best] ?? 0;
  let pmpW = vmpV * (is[best] ?? 0);
  const windowIdx = vs.map((v, k) => [v, k] as const).filter(([v]) => v >= 0.75 * vmpV && v <= 1.15 * vmpV);
  if (windowIdx.length >= 8) {
    const wv = windowIdx.map(([v]) => v);
    const wp = windowIdx.map(([v, k]) => v * (is[k] ?? 0));
    const c = fitPolynomial(wv, wp, 4);
    const poly = (v: number): number => c.reduce((s, ck, k) => s + ck * v ** k, 0);
    const lo = wv[0] ?? vmpV;
    const hi = wv[wv.length - 1] ?? vmpV;
    const vFit = maximizeScalar(poly, lo, hi, 1e-9 * vocV);
    const pFit = poly(vFit);
    if (Math.abs(pFit / pmpW - 1) < 0.01 && vFit > lo && vFit < hi) {
      vmpV = vFit;
      pmpW = pFit;
    }
  }
  const impA = pmpW / vmpV;

  // Slopes (§9.2): quadratic fits, derivative at the end point.
  const nearOc = points.filter((p) => p.currentA <= 0.1 * iscA);
  const ocPts = nearOc.length >= 4 ? nearOc : points.slice(n - 4);
  const oc = fitPolynomial(
    ocPts.map((p) => p.currentA),
    ocPts.map((p) => p.voltageV),
    Math.min(2, ocPts.length - 2),
  );
  const rocOhm = -(oc[1] ?? 0);
  const nearSc = points.filter((p) => p.voltageV <= 0.2 * vocV);
  const scPts = nearSc.length >= 4 ? nearSc : points.slice(0, 4);
  const sc = fitPolynomial(
    scPts.map((p) => p.voltageV),
    scPts.map((p) => p.currentA),
    Math.min(2, scPts.length - 2),
  );
  const rscOhm = -1 / (sc[1] ?? -0);
  const seriesOhmEstimate =
    options.modifiedIdealityV === undefined ? rocOhm : rocOhm - options.modifiedIdealityV / iscA;

  return {
    iscA,
    vocV,
    pmpW,
    vmpV,
    impA,
    fillFactor: pmpW / (vocV * iscA),
    rocOhm,
    rscOhm,
    seriesOhmEstimate,
    shuntOhmEstimate: rscOhm,
    steps: findSteps(vs, is, iscA, vocV, options),
  };
}

function findSteps(
  vs: readonly number[],
  is: readonly number[],
  iscA: number,
  vocV: number,
  options: AnalyzeCurveOptions,
): CurveStep[] {
  const minDrop = (options.stepMinDropFraction ?? 0.05) * iscA;
  const minPlateau = options.substringVocV === undefined ? 0.005 * vocV : 0.5 * options.substringVocV;
  const steepSlope = 1;
  const flatRatio = 0.5;
  const m = 1000;
  const dv = vocV / (m - 1);
  const gridV: number[] = [];
  const gridI: number[] = [];
  let seg = 0;
  for (let k = 0; k < m; k += 1) {
    const v = k * dv;
    while (seg < vs.length - 2 && (vs[seg + 1] ?? 0) < v) seg += 1;
    const v0 = vs[seg] ?? 0;
    const v1 = vs[seg + 1] ?? v0;
    const i0 = is[seg] ?? 0;
    const i1 = is[seg + 1] ?? i0;
    const w = v1 > v0 ? (v - v0) / (v1 - v0) : 0;
    gridV.push(v);
    gridI.push(i0 + w * (i1 - i0));
  }
  const raw = gridI.map((_, k) => {
    const a = gridI[Math.max(0, k - 1)] ?? 0;
    const b = gridI[Math.min(m - 1, k + 1)] ?? 0;
    const span = (Math.min(m - 1, k + 1) - Math.max(0, k - 1)) * dv;
    return (-(b - a) / span) * (vocV / iscA);
  });
  const slope = raw.map((_, k) => {
    const window = raw.slice(Math.max(0, k - 1), Math.min(m, k + 2)).sort((x, y) => x - y);
    return window[Math.floor(window.length / 2)] ?? 0;
  });

  // Steep runs (slope > 1) separated by gaps; a run followed by a gap and then another steep run is a step.
  const runs: { from: number; to: number; peak: number }[] = [];
  for (let k = 0; k < m; k += 1) {
    if ((slope[k] ?? 0) <= steepSlope) continue;
    const from = k;
    let peak = 0;
    while (k < m && (slope[k] ?? 0) > steepSlope) {
      peak = Math.max(peak, slope[k] ?? 0);
      k += 1;
    }
    runs.push({ from, to: k, peak });
  }
  const steps: CurveStep[] = [];
  for (let r = 0; r + 1 < runs.length; r += 1) {
    const run = runs[r];
    const next = runs[r + 1];
    if (run === undefined || next === undefined) continue;
    const gapWidth = (gridV[next.from] ?? 0) - (gridV[run.to] ?? 0);
    let valley = Infinity;
    for (let k = run.to; k < next.from; k += 1) valley = Math.min(valley, slope[k] ?? 0);
    const top = Math.max(0, run.from - 1);
    const dropA = (gridI[top] ?? 0) - (gridI[run.to] ?? 0);
    if (gapWidth >= minPlateau && dropA >= minDrop && valley <= flatRatio * run.peak) {
      steps.push({ atV: gridV[top] ?? 0, atA: gridI[top] ?? 0, dropA });
    }
  }
  return steps;
}
