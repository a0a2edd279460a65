import { lambertWLog } from './lambert-w-log.ts';
import type { SingleDiodeParams } from './types.ts';

/**
 * Current I (A) of the single-diode model at terminal voltage `voltageV` (V), explicit through the
 * Lambert W function (Jain & Kapoor 2004, eq. 2; pv-field-testing §5.2), evaluated in the log
 * domain so it never overflows. Valid for any voltage in forward bias; the model has no
 * reverse-breakdown term (see `simulateString` for Bishop's extension). Parameters are not
 * validated here (hot path); use `assertSingleDiodeParams` at the boundary.
 */
export function singleDiodeCurrent(params: SingleDiodeParams, voltageV: number): number {
  const {
    photoCurrentA: il,
    saturationCurrentA: i0,
    seriesOhm: rs,
    shuntOhm: rsh,
    modifiedIdealityV: a,
  } = params;
  const gsh = 1 / rsh;
  if (rs === 0) return il - i0 * Math.expm1(voltageV / a) - voltageV * gsh;
  const denom = 1 + rs * gsh;
  const lnTheta = Math.log((rs * i0) / (a * denom)) + (rs * (il + i0) + voltageV) / (a * denom);
  return (il + i0 - gsh * voltageV) / denom - (a / rs) * lambertWLog(lnTheta);
}
