import { assertModuleSpec } from './assert-module-spec.ts';
import { assertNumber } from './assert-number.ts';
import { bishopDiodeVoltage } from './bishop-diode-voltage.ts';
import { findRoot } from './find-root.ts';
import { maximizeScalar } from './maximize-scalar.ts';
import { SIMULATION_DEFAULTS } from './simulation-defaults.ts';
import { singleDiodeParamsAt } from './single-diode-params-at.ts';
import type { CurvePoints, IvPoint, ModuleSpec, ReverseBiasParams, SingleDiodeParams } from './types.ts';

/** A partly shaded cell: `module` and `cell` are 0-based positions, `fraction` the share of irradiance blocked (0 … 1). */
export type ShadedCell = { readonly module: number; readonly cell: number; readonly fraction: number };

/** Input of {@link simulateString}. */
export type SimulateStringInput = {
  readonly module: ModuleSpec;
  /** Modules in series (whole number 1 … 1000). */
  readonly modulesInSeries: number;
  /** Unshaded plane-of-array irradiance, W/m² (> 0 … 2000). */
  readonly irradianceWm2: number;
  /** Module (cell) temperature, °C, the same for every cell. */
  readonly moduleTempC: number;
  /** Shaded cells; cells listed twice take the larger fraction. Cells are numbered along the series path; cell c belongs to substring ⌊c / (cellsInSeries / bypassDiodes)⌋. */
  readonly shading?: readonly ShadedCell[];
  /** Bishop reverse-bias parameters of every cell (default SIMULATION_DEFAULTS.reverse). */
  readonly reverse?: ReverseBiasParams;
  /** Bypass diode forward drop, V (≥ 0; default SIMULATION_DEFAULTS.bypassDiodeDropV). */
  readonly bypassDiodeDropV?: number;
  /** Points on the returned curve (10 … 10 000; default 400). */
  readonly points?: number;
};

/** Result of {@link simulateString}. */
export type SimulatedString = CurvePoints & {
  /** The string's I-V curve from (0 V, Isc) to (Voc, 0 A), voltage ascending, spaced evenly along the curve. */
  readonly curve: IvPoint[];
  /** Substrings whose bypass diode conducts at the maximum-power point. */
  readonly bypassedSubstringsAtMpp: number;
  /** Distinct cell curves that were computed (identical cells share one). */
  readonly distinctCells: number;
  /** Distinct substrings that were summed (identical substrings share one). */
  readonly distinctSubstrings: number;
};

type Substring = {
  readonly cells: readonly (readonly [type: number, count: number])[];
  multiplicity: number;
};

/**
 * I-V curve of a series string with partial shading, cell by cell (pv-field-testing §6).
 *
 * Each module's single-diode parameters come from the De Soto fit of its datasheet at the
 * irradiance and temperature (§5.3–5.4); a cell gets a = a_mod/Ns, Rs = Rs_mod/Ns, Rsh = Rsh_mod/Ns
 * and the same IL and I0, and is extended into reverse bias after Bishop (1988). Shading scales a
 * cell's photocurrent by (1 − fraction); its Rs, Rsh, I0 and a stay at the operating values (as in
 * pvlib's bishop88 partial-shading example). Each substring of cellsInSeries/bypassDiodes cells is
 * protected by a bypass diode, modelled as an ideal clamp at −bypassDiodeDropV: the substring's
 * voltage is max(Σ cell voltages, −Vf) at the string current. Voltages add at equal current for
 * cells in a substring, substrings in a module and modules in the string.
 *
 * So a shaded cell drives its substring into reverse bias once the string current exceeds what it
 * can carry, until the diode clamps the substring near −Vf: at high current the string loses that
 * substring's voltage plus one diode drop, and the curve shows a step.
 *
 * Identical cells share one computed curve and identical substrings one sum, so the cost depends
 * on the number of distinct shading fractions, not on the number of cells. The curve is sampled
 * adaptively in current (segments ≤ 2/points of the normalised length) and resampled evenly along
 * its normalised length; Isc, Voc and the
 * maximum-power point are solved on the exact model (A, V, W).
 * Throws a RangeError on invalid input.
 */
export function simulateString(input: SimulateStringInput): SimulatedString {
  const { module, modulesInSeries, irradianceWm2, moduleTempC } = input;
  assertModuleSpec(module);
  assertNumber(modulesInSeries, 'modulesInSeries', { integer: true, min: 1, max: 1000 });
  const reverse = input.reverse ?? SIMULATION_DEFAULTS.reverse;
  assertNumber(reverse.breakdownV, 'reverse.breakdownV', { lessThan: 0 });
  assertNumber(reverse.a, 'reverse.a', { min: 0 });
  assertNumber(reverse.m, 'reverse.m', { greaterThan: 0 });
  const dropV = input.bypassDiodeDropV ?? SIMULATION_DEFAULTS.bypassDiodeDropV;
  assertNumber(dropV, 'bypassDiodeDropV', { min: 0, max: 5 });
  const points = input.points ?? SIMULATION_DEFAULTS.points;
  assertNumber(points, 'points', { integer: true, min: 10, max: 10_000 });

  const ns = module.cellsInSeries;
  const cellsPerSubstring = ns / module.bypassDiodes;
  const moduleParams = singleDiodeParamsAt(module, { irradianceWm2, cellTempC: moduleTempC });
  const unshaded: SingleDiodeParams = {
    photoCurrentA: moduleParams.photoCurrentA,
    saturationCurrentA: moduleParams.saturationCurrentA,
    seriesOhm: moduleParams.seriesOhm / ns,
    shuntOhm: moduleParams.shuntOhm / ns,
    modifiedIdealityV: moduleParams.modifiedIdealityV / ns,
  };

  // Shading per module: cell index → largest blocked fraction.
  const shadeByModule = new Map<number, Map<number, number>>();
  for (const [index, shade] of (input.shading ?? []).entries()) {
    assertNumber(shade.module, `shading[${index}].module`, {
      integer: true,
      min: 0,
      max: modulesInSeries - 1,
    });
    assertNumber(shade.cell, `shading[${index}].cell`, { integer: true, min: 0, max: ns - 1 });
    assertNumber(shade.fraction, `shading[${index}].fraction`, { min: 0, max: 1 });
    if (shade.fraction === 0) continue;
    const cells = shadeByModule.get(shade.module) ?? new Map<number, number>();
    cells.set(shade.cell, Math.max(cells.get(shade.cell) ?? 0, shade.fraction));
    shadeByModule.set(shade.module, cells);
  }

  // Distinct cell types, keyed by transmitted fraction; type 0 is the unshaded cell.
  const transmissions: number[] = [1];
  const typeOf = (transmission: number): number => {
    const found = transmissions.indexOf(transmission);
    if (found >= 0) return found;
    transmissions.push(transmission);
    return transmissions.length - 1;
  };
  const substrings = new Map<string, Substring>();
  const addSubstring = (counts: Map<number, number>, multiplicity: number): void => {
    const cells = [...counts.entries()].filter(([, n]) => n > 0).sort((x, y) => x[0] - y[0]);
    const key = cells.map(([t, n]) => `${t}:${n}`).join(',');
    const existing = substrings.get(key);
    if (existing !== undefined) existing.multiplicity += multiplicity;
    else substrings.set(key, { cells, multiplicity });
  };
  let shadedSubstringCount = 0;
  for (const cells of shadeByModule.values()) {
    const bySubstring = new Map<number, Map<number, number>>();
    for (const [cell, fraction] of cells) {
      const s = Math.floor(cell / cellsPerSubstring);
      const counts = bySubstring.get(s) ?? new Map<number, number>([[0, cellsPerSubstring]]);
      const t = typeOf(1 - fraction);
      counts.set(0, (counts.get(0) ?? 0) - 1);
      counts.set(t, (counts.get(t) ?? 0) + 1);
      bySubstring.set(s, counts);
    }
    for (const counts of bySubstring.values()) addSubstring(counts, 1);
    shadedSubstringCount += bySubstring.size;
  }
  const totalSubstrings = modulesInSeries * module.bypassDiodes;
  if (totalSubstrings > shadedSubstringCount) {
    addSubstring(new Map([[0, cellsPerSubstring]]), totalSubstrings - shadedSubstringCount);
  }
  const cellTypes: SingleDiodeParams[] = transmissions.map((t) => ({
    ...unshaded,
    photoCurrentA: unshaded.photoCurrentA * t,
  }));
  const substringList = [...substrings.values()];
  const rsCell = unshaded.seriesOhm;

  const lastVd = new Float64Array(cellTypes.length);
  const cellV = new Float64Array(cellTypes.length);
  const cellVoltages = (currentA: number): void => {
    for (let t = 0; t < cellTypes.length; t += 1) {
      const type = cellTypes[t];
      if (type === undefined) continue;
      const vd = bishopDiodeVoltage(type, reverse, currentA, lastVd[t]);
      lastVd[t] = vd;
      cellV[t] = vd - currentA * rsCell;
    }
  };
  const substringVoltage = (substring: Substring): number => {
    let sum = 0;
    for (const [t, n] of substring.cells) sum += n * (cellV[t] ?? 0);
    return sum;
  };
  const stringVoltage = (currentA: number): number => {
    cellVoltages(currentA);
    let v = 0;
    for (const substring of substringList)
      v += substring.multiplicity * Math.max(substringVoltage(substring), -dropV);
    return v;
  };

  const maxPhotoCurrentA = Math.max(...cellTypes.map((c) => c.photoCurrentA));
  const vocV = stringVoltage(0);
  if (!(maxPhotoCurrentA > 0) || !(vocV > 0)) {
    return {
      iscA: 0,
      vocV: 0,
      impA: 0,
      vmpV: 0,
      pmpW: 0,
      curve: [{ voltageV: 0, currentA: 0 }],
      bypassedSubstringsAtMpp: 0,
      distinctCells: cellTypes.length,
      distinctSubstrings: substringList.length,
    };
  }
  const iscA = findRoot(stringVoltage, 0, maxPhotoCurrentA, 1e-12 * maxPhotoCurrentA);

  // Adaptive sampling in current: split any segment longer than 2/points of the normalised curve.
  const initial = Math.max(16, Math.ceil(points / 8));
  let samples: { i: number; v: number }[] = [];
  for (let k = 0; k <= initial; k += 1) {
    const i = k === initial ? iscA : (iscA * k) / initial;
    samples.push({ i, v: k === 0 ? vocV : k === initial ? 0 : stringVoltage(i) });
  }
  const maxSegment = 2 / points;
  const segmentLength = (p: { i: number; v: number }, q: { i: number; v: number }): number => {
    const dv = (q.v - p.v) / vocV;
    const di = (q.i - p.i) / iscA;
    return Math.sqrt(dv * dv + di * di);
  };
  for (let pass = 0; pass < 24; pass += 1) {
    const refined: { i: number; v: number }[] = [];
    let split = false;
    for (let k = 0; k < samples.length; k += 1) {
      const p = samples[k];
      if (p === undefined) continue;
      refined.push(p);
      const q = samples[k + 1];
      const length = q === undefined ? 0 : segmentLength(p, q);
      if (q !== undefined && length > maxSegment && q.i - p.i > 1e-12 * iscA) {
        const parts = Math.min(64, Math.ceil(length / maxSegment));
        for (let part = 1; part < parts; part += 1) {
          const i = p.i + ((q.i - p.i) * part) / parts;
          refined.push({ i, v: stringVoltage(i) });
        }
        split = true;
      }
    }
    samples = refined;
    if (!split) break;
  }

  // Maximum power: best sample, then golden section between its neighbours on the exact model.
  let best = 0;
  for (let k = 1; k < samples.length; k += 1) {
    const s = samples[k];
    const b = samples[best];
    if (s !== undefined && b !== undefined && s.i * s.v > b.i * b.v) best = k;
  }
  const loI = samples[Math.max(0, best - 1)]?.i ?? 0;
  const hiI = samples[Math.min(samples.length - 1, best + 1)]?.i ?? iscA;
  const impA = maximizeScalar((i) => i * stringVoltage(i), loI, hiI, 1e-10 * iscA);
  const vmpV = stringVoltage(impA);
  let bypassedSubstringsAtMpp = 0;
  for (const substring of substringList) {
    if (substringVoltage(substring) < -dropV) bypassedSubstringsAtMpp += substring.multiplicity;
  }

  return {
    iscA,
    vocV,
    impA,
    vmpV,
    pmpW: impA * vmpV,
    curve: resampleEvenly(samples, points, vocV, iscA),
    bypassedSubstringsAtMpp,
    distinctCells: cellTypes.length,
    distinctSubstrings: substringList.length,
  };
}

/** Resamples a polyline ordered by current (Voc end first) to `points` points evenly spaced along its normalised length, voltage ascending. */
function resampleEvenly(
  samples: readonly { i: number; v: number }[],
  points: number,
  vocV: number,
  iscA: number,
): IvPoint[] {
  const ordered = [...samples].reverse();
  const cumulative: number[] = [0];
  for (let k = 1; k < ordered.length; k += 1) {
    const p = ordered[k - 1];
    const q = ordered[k];
    const previous = cumulative[k - 1] ?? 0;
    if (p === undefined || q === undefined) {
      cumulative.push(previous);
      continue;
    }
    const dv = (q.v - p.v) / vocV;
    const di = (q.i - p.i) / iscA;
    cumulative.push(previous + Math.sqrt(dv * dv + di * di));
  }
  const total = cumulative[cumulative.length - 1] ?? 0;
  const curve: IvPoint[] = [];
  let segment = 0;
  for (let n = 0; n < points; n += 1) {
    const target = (total * n) / (points - 1);
    while (segment < ordered.length - 2 && (cumulative[segment + 1] ?? 0) < target) segment += 1;
    const p = ordered[segment];
    const q = ordered[segment + 1];
    if (p === undefined || q === undefined) break;
    const s0 = cumulative[segment] ?? 0;
    const s1 = cumulative[segment + 1] ?? s0;
    const w = s1 > s0 ? Math.min(1, Math.max(0, (target - s0) / (s1 - s0))) : 0;
    curve.push({ voltageV: p.v + w * (q.v - p.v), currentA: p.i + w * (q.i - p.i) });
  }
  const last = ordered[ordered.length - 1];
  if (last !== undefined) curve[curve.length - 1] = { voltageV: last.v, currentA: last.i };
  return curve;
}
