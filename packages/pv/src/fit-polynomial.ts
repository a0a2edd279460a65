import { solveLinearSystem } from './solve-linear-system.ts';

/**
 * Least-squares polynomial fit y ≈ Σ c_k·x^k (k = 0 … order). Returns the coefficients, lowest
 * order first. The abscissa is centred and scaled internally for conditioning. Throws a
 * RangeError with fewer than order + 1 points.
 */
export function fitPolynomial(xs: readonly number[], ys: readonly number[], order: number): number[] {
  const n = Math.min(xs.length, ys.length);
  if (n < order + 1) throw new RangeError(`fitPolynomial: need at least ${order + 1} points, got ${n}`);
  let lo = Infinity;
  let hi = -Infinity;
  for (let k = 0; k < n; k += 1) {
    const x = xs[k] ?? 0;
    lo = Math.min(lo, x);
    hi = Math.max(hi, x);
  }
  const centre = (lo + hi) / 2;
  const half = (hi - lo) / 2 || 1;
  const size = order + 1;
  const normal: number[][] = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  const rhs = new Array<number>(size).fill(0);
  for (let k = 0; k < n; k += 1) {
    const u = ((xs[k] ?? 0) - centre) / half;
    const powers = [1];
    for (let p = 1; p <= 2 * order; p += 1) powers.push((powers[p - 1] ?? 0) * u);
    for (let r = 0; r < size; r += 1) {
      rhs[r] = (rhs[r] ?? 0) + (powers[r] ?? 0) * (ys[k] ?? 0);
      const row = normal[r];
      if (row === undefined) continue;
      for (let c = 0; c < size; c += 1) row[c] = (row[c] ?? 0) + (powers[r + c] ?? 0);
    }
  }
  const scaled = solveLinearSystem(normal, rhs);
  // Expand Σ b_k·((x − centre)/half)^k back to powers of x.
  const coefficients = new Array<number>(size).fill(0);
  for (let k = 0; k < size; k += 1) {
    const b = (scaled[k] ?? 0) / half ** k;
    let binomial = 1;
    for (let j = 0; j <= k; j += 1) {
      coefficients[j] = (coefficients[j] ?? 0) + b * binomial * (-centre) ** (k - j);
      binomial = (binomial * (k - j)) / (j + 1);
    }
  }
  return coefficients;
}
