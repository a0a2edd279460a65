/**
 * Solves the dense linear system A·x = b by Gaussian elimination with partial pivoting
 * (small systems only, e.g. the 5×5 Newton step of the De Soto fit). `a` is row-major and is not
 * modified. Throws a RangeError when the matrix is singular to working precision.
 */
export function solveLinearSystem(a: readonly (readonly number[])[], b: readonly number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i] ?? 0]);
  for (let col = 0; col < n; col += 1) {
    let pivot = col;
    for (let row = col + 1; row < n; row += 1) {
      if (Math.abs(m[row]?.[col] ?? 0) > Math.abs(m[pivot]?.[col] ?? 0)) pivot = row;
    }
    const pivotRow = m[pivot];
    const current = m[col];
    if (pivotRow === undefined || current === undefined) throw new RangeError('solveLinearSystem: bad shape');
    const p = pivotRow[col] ?? 0;
    if (Math.abs(p) < 1e-300) throw new RangeError('solveLinearSystem: singular matrix');
    m[pivot] = current;
    m[col] = pivotRow;
    for (let row = col + 1; row < n; row += 1) {
      const r = m[row];
      if (r === undefined) continue;
      const factor = (r[col] ?? 0) / p;
      for (let k = col; k <= n; k += 1) r[k] = (r[k] ?? 0) - factor * (pivotRow[k] ?? 0);
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let row = n - 1; row >= 0; row -= 1) {
    const r = m[row];
    if (r === undefined) continue;
    let s = r[n] ?? 0;
    for (let k = row + 1; k < n; k += 1) s -= (r[k] ?? 0) * (x[k] ?? 0);
    x[row] = s / (r[row] ?? 1);
  }
  return x;
}
