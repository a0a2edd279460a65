/**
 * Golden-section search for the maximum of a unimodal function on [lo, hi]; returns the argument.
 * Stops when the interval is narrower than `tolerance` (absolute).
 */
export function maximizeScalar(f: (x: number) => number, lo: number, hi: number, tolerance = 1e-10): number {
  const invPhi = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - invPhi * (b - a);
  let d = a + invPhi * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let iteration = 0; iteration < 200 && b - a > tolerance; iteration += 1) {
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - invPhi * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + invPhi * (b - a);
      fd = f(d);
    }
  }
  return (a + b) / 2;
}
