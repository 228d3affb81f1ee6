/**
 * Solves the dense complex linear system A z = b in place (A and b overwritten; the solution is left in b).
 *
 * Method: Gaussian elimination with partial pivoting on the modulus, split real/imaginary Float64Array storage
 * (row-major, `size`×`size`). No allocation: the caller owns every buffer.
 * Notes: returns false when a pivot is exactly zero (singular matrix); accuracy is that of LU with partial
 * pivoting (Golub & Van Loan, *Matrix Computations*, 4th ed., §3.4).
 *
 * @param size order of the system
 * @param aRe real part of A, row-major, overwritten
 * @param aIm imaginary part of A, row-major, overwritten
 * @param bRe real part of b, replaced by the solution
 * @param bIm imaginary part of b, replaced by the solution
 * @returns true when solved, false when singular
 */
export function solveComplexDense(
  size: number,
  aRe: Float64Array,
  aIm: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
): boolean {
  for (let k = 0; k < size; k++) {
    let pivot = k;
    let best = aRe[k * size + k] ** 2 + aIm[k * size + k] ** 2;
    for (let r = k + 1; r < size; r++) {
      const v = aRe[r * size + k] ** 2 + aIm[r * size + k] ** 2;
      if (v > best) {
        best = v;
        pivot = r;
      }
    }
    if (best === 0) return false;
    if (pivot !== k) {
      for (let c = k; c < size; c++) {
        const i1 = k * size + c;
        const i2 = pivot * size + c;
        let t = aRe[i1];
        aRe[i1] = aRe[i2];
        aRe[i2] = t;
        t = aIm[i1];
        aIm[i1] = aIm[i2];
        aIm[i2] = t;
      }
      let t = bRe[k];
      bRe[k] = bRe[pivot];
      bRe[pivot] = t;
      t = bIm[k];
      bIm[k] = bIm[pivot];
      bIm[pivot] = t;
    }
    // 1 / pivot
    const pr = aRe[k * size + k];
    const pi = aIm[k * size + k];
    const invRe = pr / best;
    const invIm = -pi / best;
    for (let r = k + 1; r < size; r++) {
      const ar = aRe[r * size + k];
      const ai = aIm[r * size + k];
      if (ar === 0 && ai === 0) continue;
      const fr = ar * invRe - ai * invIm;
      const fi = ar * invIm + ai * invRe;
      const rowR = r * size;
      const rowK = k * size;
      for (let c = k + 1; c < size; c++) {
        const xr = aRe[rowK + c];
        const xi = aIm[rowK + c];
        aRe[rowR + c] -= fr * xr - fi * xi;
        aIm[rowR + c] -= fr * xi + fi * xr;
      }
      const br = bRe[k];
      const bi = bIm[k];
      bRe[r] -= fr * br - fi * bi;
      bIm[r] -= fr * bi + fi * br;
    }
  }
  for (let k = size - 1; k >= 0; k--) {
    let sr = bRe[k];
    let si = bIm[k];
    const row = k * size;
    for (let c = k + 1; c < size; c++) {
      const ar = aRe[row + c];
      const ai = aIm[row + c];
      sr -= ar * bRe[c] - ai * bIm[c];
      si -= ar * bIm[c] + ai * bRe[c];
    }
    const pr = aRe[row + k];
    const pi = aIm[row + k];
    const d = pr * pr + pi * pi;
    bRe[k] = (sr * pr + si * pi) / d;
    bIm[k] = (si * pr - sr * pi) / d;
  }
  return true;
}
