import { lambertWLog } from './lambert-w-log.ts';
import type { SingleDiodeParams } from './types.ts';

/**
 * Terminal voltage V (V) of the single-diode model at current `currentA` (A), explicit through the
 * Lambert W function (Jain & Kapoor 2004, eq. 3; pv-field-testing §5.2). The W argument
 * ψ = I0/(Gsh·a)·exp[(IL + I0 − I)/(Gsh·a)] overflows at module scale (exponent ≈ 750), so it is
 * passed as ln ψ. With Rsh = ∞ the closed form V = a·ln(1 + (IL − I)/I0) − I·Rs is used (then
 * I must stay below IL + I0). Parameters are not validated here (hot path).
 */
export function singleDiodeVoltage(params: SingleDiodeParams, currentA: number): number {
  const {
    photoCurrentA: il,
    saturationCurrentA: i0,
    seriesOhm: rs,
    shuntOhm: rsh,
    modifiedIdealityV: a,
  } = params;
  if (rsh === Infinity) return a * Math.log1p((il - currentA) / i0) - currentA * rs;
  const gsh = 1 / rsh;
  const lnPsi = Math.log(i0 / (gsh * a)) + (il + i0 - currentA) / (gsh * a);
  return (il + i0 - currentA) / gsh - currentA * rs - a * lambertWLog(lnPsi);
}
