/**
 * Sign of the determinant of a real n×n matrix: +1, −1, or 0 when it is singular to working precision.
 *
 * Method: Gaussian elimination with partial pivoting (Golub & Van Loan, *Matrix Computations*, 4th ed.,
 * Alg. 3.4.1); the sign is the product of the pivots' signs and of (−1) per row interchange. Only signs are
 * multiplied, so large matrices with large entries cannot overflow.
 * @param n order
 * @param a the matrix (n×n row-major), overwritten by the factors
 * @returns sign of det a
 */
export function determinantSign(n: number, a: Float64Array): number {
  let sign = 1;
  for (let k = 0; k < n; k++) {
    let pivot = k;
    let best = Math.abs(a[k * n + k]);
    for (let r = k + 1; r < n; r++) {
      const v = Math.abs(a[r * n + k]);
      if (v > best) {
        best = v;
        pivot = r;
      }
    }
    if (!(best > 0)) return 0;
    if (pivot !== k) {
      sign = -sign;
      for (let c = k; c < n; c++) {
        const t = a[k * n + c];
        a[k * n + c] = a[pivot * n + c];
        a[pivot * n + c] = t;
      }
    }
    const p = a[k * n + k];
    if (p < 0) sign = -sign;
    for (let r = k + 1; r < n; r++) {
      const f = a[r * n + k] / p;
      if (f === 0) continue;
      for (let c = k + 1; c < n; c++) a[r * n + c] -= f * a[k * n + c];
    }
  }
  return sign;
}
