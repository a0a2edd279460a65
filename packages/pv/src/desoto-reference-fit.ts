import { assertModuleSpec } from './assert-module-spec.ts';
import { PHYSICS } from './physical-constants.ts';
import { solveLinearSystem } from './solve-linear-system.ts';
import type { ModuleSpec, SingleDiodeParams } from './types.ts';

const cache = new Map<string, SingleDiodeParams>();
const objectCache = new WeakMap<ModuleSpec, SingleDiodeParams>();
const CACHE_LIMIT = 128;

/**
 * The De Soto, Klein & Beckman (2006) fit of a datasheet at STC (see `fitSingleDiode`), memoised:
 * by object identity first (WeakMap), then by the datasheet values (bounded Map), so repeated
 * calls with one module cost nothing. Pure: the cache only avoids recomputation.
 * Throws a RangeError on an invalid datasheet or when no physical fit exists.
 */
export function deSotoReferenceFit(module: ModuleSpec): SingleDiodeParams {
  const byObject = objectCache.get(module);
  if (byObject !== undefined) return byObject;
  const key = [
    module.iscA,
    module.vocV,
    module.impA,
    module.vmpV,
    module.alphaIscPctPerC,
    module.betaVocPctPerC,
    module.cellsInSeries,
  ].join('|');
  const hit = cache.get(key);
  if (hit !== undefined) {
    objectCache.set(module, hit);
    return hit;
  }
  assertModuleSpec(module);
  const fitted = solveDeSoto(module);
  if (cache.size >= CACHE_LIMIT) {
    const oldest = cache.keys().next().value;
    if (oldest !== undefined) cache.delete(oldest);
  }
  cache.set(key, fitted);
  objectCache.set(module, fitted);
  return fitted;
}

function solveDeSoto(module: ModuleSpec): SingleDiodeParams {
  const { iscA: isc, vocV: voc, impA: imp, vmpV: vmp, cellsInSeries: ns } = module;
  const alpha = (module.alphaIscPctPerC / 100) * isc;
  const beta = (module.betaVocPctPerC / 100) * voc;
  const k = PHYSICS.boltzmannOverChargeVPerK;
  const tref = PHYSICS.stcCellTempC + PHYSICS.zeroCelsiusK;
  const egRef = PHYSICS.siliconBandgapEv;

  // Duffie & Beckman p. 753 initial guesses (as pvlib fit_desoto).
  const a0 = 1.5 * k * tref * ns;
  const il0 = isc;
  const i00 = isc * Math.exp(-voc / a0);
  const rs0 = (a0 * Math.log1p((il0 - imp) / i00) - vmp) / imp;
  let x = [il0, Math.log(i00), Math.max(rs0, 0), Math.log(100), a0];

  const residuals = (u: readonly number[]): number[] => {
    const [il = 0, lnI0 = 0, rs = 0, lnRsh = 0, a = 1] = u;
    const i0 = Math.exp(lnI0);
    const rsh = Math.exp(lnRsh);
    const vdMp = vmp + imp * rs;
    const eMp = Math.exp(vdMp / a);
    const t2 = tref + 2;
    const voc2 = voc + 2 * beta;
    const a2 = (a * t2) / tref;
    const il2 = il + 2 * alpha;
    const eg2 = egRef * (1 + PHYSICS.siliconBandgapPerK * 2);
    const i02 = i0 * (t2 / tref) ** 3 * Math.exp((egRef / tref - eg2 / t2) / k);
    return [
      (isc - il + i0 * Math.expm1((isc * rs) / a) + (isc * rs) / rsh) / isc,
      (-il + i0 * Math.expm1(voc / a) + voc / rsh) / isc,
      (imp - il + i0 * Math.expm1(vdMp / a) + vdMp / rsh) / isc,
      (imp - (vmp * ((i0 / a) * eMp + 1 / rsh)) / (1 + ((i0 * rs) / a) * eMp + rs / rsh)) / isc,
      (-il2 + i02 * Math.expm1(voc2 / a2) + voc2 / rsh) / isc,
    ];
  };
  const norm = (r: readonly number[]): number => Math.sqrt(r.reduce((s, v) => s + v * v, 0));

  let r = residuals(x);
  let rNorm = norm(r);
  for (let iteration = 0; iteration < 100 && rNorm > 1e-14; iteration += 1) {
    const jacobian: number[][] = [[], [], [], [], []];
    for (let j = 0; j < 5; j += 1) {
      const xj = x[j] ?? 0;
      const h = 1e-7 * Math.max(Math.abs(xj), 1e-2);
      const shifted = x.slice();
      shifted[j] = xj + h;
      const rh = residuals(shifted);
      for (let i = 0; i < 5; i += 1) jacobian[i]?.push(((rh[i] ?? 0) - (r[i] ?? 0)) / h);
    }
    let step: number[];
    try {
      step = solveLinearSystem(
        jacobian,
        r.map((v) => -v),
      );
    } catch {
      break;
    }
    let lambda = 1;
    let accepted = false;
    for (let halving = 0; halving < 40; halving += 1) {
      const trial = x.map((v, i) => v + lambda * (step[i] ?? 0));
      const rt = residuals(trial);
      const nt = norm(rt);
      if (Number.isFinite(nt) && (trial[4] ?? 0) > 0 && nt < rNorm) {
        x = trial;
        r = rt;
        rNorm = nt;
        accepted = true;
        break;
      }
      lambda /= 2;
    }
    if (!accepted) break;
  }
  const [il = 0, lnI0 = 0, rs = 0, lnRsh = 0, a = 0] = x;
  if (!(rNorm < 1e-8) || rs < 0 || !(a > 0)) {
    throw new RangeError(
      `fitSingleDiode: no physical De Soto fit for Voc ${voc} V, Isc ${isc} A, Vmp ${vmp} V, Imp ${imp} A (check the datasheet values)`,
    );
  }
  return {
    photoCurrentA: il,
    saturationCurrentA: Math.exp(lnI0),
    seriesOhm: rs,
    shuntOhm: Math.exp(lnRsh),
    modifiedIdealityV: a,
  };
}
