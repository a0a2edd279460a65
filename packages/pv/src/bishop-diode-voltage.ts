import type { ReverseBiasParams, SingleDiodeParams } from './types.ts';

/**
 * Diode (junction) voltage Vd, V, at which one cell carries `currentA` (A ≥ 0), for the
 * single-diode model extended into reverse bias by Bishop (Solar Cells 25, 1988, 73–89; as pvlib
 * singlediode.bishop88; pv-field-testing §6.1):
 * I = IL − I0·[exp(Vd/a) − 1] − Vd/Rsh − a_br·(Vd/Rsh)·(1 − Vd/Vbr)^(−m).
 * The terminal voltage is Vd − I·Rs. I(Vd) decreases strictly, so the root is bracketed between
 * just above Vbr (or a shunt-limited bound when a_br = 0) and the forward bound, and found by
 * safeguarded Newton steps from `guessV` (warm starts make neighbouring currents cheap).
 * Needs a finite shunt resistance. Not validated (hot path).
 */
export function bishopDiodeVoltage(
  cell: SingleDiodeParams,
  reverse: ReverseBiasParams,
  currentA: number,
  guessV = 0,
): number {
  const { photoCurrentA: il, saturationCurrentA: i0, shuntOhm: rsh, modifiedIdealityV: a } = cell;
  const { breakdownV: vbr, a: aBr, m } = reverse;
  const gsh = 1 / rsh;
  let lo = aBr > 0 ? vbr * (1 - 1e-12) : Math.min(0, -(currentA - il + 1) * rsh);
  let hi = a * Math.log((il + currentA + 1) / i0);
  let x = guessV > lo && guessV < hi ? guessV : (lo + hi) / 2;
  for (let iteration = 0; iteration < 100; iteration += 1) {
    const e = Math.exp(x / a);
    let g = il - i0 * (e - 1) - x * gsh - currentA;
    let dg = -(i0 / a) * e - gsh;
    if (aBr > 0) {
      const base = 1 - x / vbr;
      const p = base ** -m;
      g -= aBr * x * gsh * p;
      dg -= aBr * gsh * (p + ((x * m) / vbr) * (p / base));
    }
    const step = g / dg;
    if (Math.abs(step) <= 1e-13 + 1e-13 * Math.abs(x)) return x - step;
    if (g > 0) lo = x;
    else hi = x;
    let next = x - step;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (hi - lo <= 1e-13 + 1e-13 * Math.abs(x)) return next;
    x = next;
  }
  return x;
}
