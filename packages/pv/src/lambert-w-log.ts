/**
 * Principal branch of the Lambert W function evaluated from the logarithm of its argument:
 * returns w ≥ 0 with w·e^w = x, given `lnX` = ln x (any real, so x may be far beyond double range,
 * as the single-diode model needs at module and string scale, pv-field-testing §5.2).
 *
 * Solves w + ln w = ln x with Halley's method from Winitzki's / the asymptotic starting value;
 * converges to double precision in a few steps. For ln x < −40, W(x) = x to double precision.
 * Throws a RangeError on NaN.
 */
export function lambertWLog(lnX: number): number {
  if (Number.isNaN(lnX)) throw new RangeError('lambertWLog needs a number, got NaN');
  if (lnX === Infinity) return Infinity;
  if (lnX < -40) return Math.exp(lnX);
  let w: number;
  if (lnX > 1) {
    const l = Math.log(lnX);
    w = lnX - l + l / lnX;
  } else {
    const l = Math.log1p(Math.exp(lnX));
    w = l * (1 - Math.log1p(l) / (2 + l));
  }
  for (let iteration = 0; iteration < 20; iteration += 1) {
    const f = w + Math.log(w) - lnX;
    const df = 1 + 1 / w;
    const d2f = -1 / (w * w);
    let next = w - f / (df - (f * d2f) / (2 * df));
    if (!(next > 0)) next = w / 2;
    if (Math.abs(next - w) <= 4e-16 * next) return next;
    w = next;
  }
  return w;
}
