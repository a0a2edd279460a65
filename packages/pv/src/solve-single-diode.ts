import { assertSingleDiodeParams } from './assert-single-diode-params.ts';
import { findRoot } from './find-root.ts';
import { singleDiodeCurrent } from './single-diode-current.ts';
import { singleDiodeVoltage } from './single-diode-voltage.ts';
import type { CurvePoints, SingleDiodeParams } from './types.ts';

/**
 * Isc, Voc and the maximum-power point of a single-diode model (pv-field-testing §5.2):
 * Isc = I(0) and Voc = V(0) by the explicit Lambert W solutions, Vmp as the root of dP/dV = 0 on
 * [0, Voc] (Brent, to 1e-12 V), with dI/dV from implicit differentiation. Units: A, V, W.
 * Throws a RangeError on invalid parameters; returns zeros when IL = 0 (a dark device).
 */
export function solveSingleDiode(params: SingleDiodeParams): CurvePoints {
  assertSingleDiodeParams(params);
  if (params.photoCurrentA === 0) return { iscA: 0, vocV: 0, impA: 0, vmpV: 0, pmpW: 0 };
  const iscA = singleDiodeCurrent(params, 0);
  const vocV = singleDiodeVoltage(params, 0);
  const { saturationCurrentA: i0, seriesOhm: rs, shuntOhm: rsh, modifiedIdealityV: a } = params;
  const dPdV = (v: number): number => {
    const i = singleDiodeCurrent(params, v);
    const g = (i0 / a) * Math.exp((v + i * rs) / a) + 1 / rsh;
    const dIdV = -1 / (1 / g + rs);
    return i + v * dIdV;
  };
  // Vmp lies above Voc/2 for any curve with a fill factor above 0.5; start there when the sign allows.
  const half = vocV / 2;
  const lo = dPdV(half) > 0 ? half : 0;
  const vmpV = findRoot(dPdV, lo, vocV, 1e-12 * Math.max(1, vocV));
  const impA = singleDiodeCurrent(params, vmpV);
  return { iscA, vocV, impA, vmpV, pmpW: vmpV * impA };
}
