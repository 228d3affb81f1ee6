/**
 * LU factorisation of a dense complex matrix in place, with partial pivoting: P A = L U, L unit lower
 * triangular (stored below the diagonal), U upper triangular (on and above it).
 *
 * Method: Gaussian elimination by columns, pivot = the largest modulus in the column (Golub & Van Loan,
 * *Matrix Computations*, 4th ed., Alg. 3.4.1), split real/imaginary Float64Array storage, row-major. No
 * allocation: the caller owns the buffers. Solve with `solveComplexLu`; the factors can be reused for several
 * right-hand sides (the p-k core's chord iterations).
 * Notes: returns false when a pivot is exactly zero (singular matrix).
 * @param size order n
 * @param aRe real part of A (n×n row-major), overwritten by the factors
 * @param aIm imaginary part of A, overwritten
 * @param pivots receives the row interchanges (length n)
 * @returns true when factorised, false when singular
 */
export function factorComplexLu(size: number, aRe: Float64Array, aIm: Float64Array, pivots: Int32Array): boolean {
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
    pivots[k] = pivot;
    if (best === 0) return false;
    if (pivot !== k) {
      for (let c = 0; c < size; c++) {
        const i1 = k * size + c;
        const i2 = pivot * size + c;
        let t = aRe[i1];
        aRe[i1] = aRe[i2];
        aRe[i2] = t;
        t = aIm[i1];
        aIm[i1] = aIm[i2];
        aIm[i2] = t;
      }
    }
    const rowK = k * size;
    const invRe = aRe[rowK + k] / best;
    const invIm = -aIm[rowK + k] / best;
    for (let r = k + 1; r < size; r++) {
      const rowR = r * size;
      const ar = aRe[rowR + k];
      const ai = aIm[rowR + k];
      if (ar === 0 && ai === 0) continue;
      const fr = ar * invRe - ai * invIm;
      const fi = ar * invIm + ai * invRe;
      aRe[rowR + k] = fr;
      aIm[rowR + k] = fi;
      for (let c = k + 1; c < size; c++) {
        const xr = aRe[rowK + c];
        const xi = aIm[rowK + c];
        aRe[rowR + c] -= fr * xr - fi * xi;
        aIm[rowR + c] -= fr * xi + fi * xr;
      }
    }
  }
  return true;
}

/**
 * Solves A z = b with the factors of `factorComplexLu` (forward and back substitution), b overwritten by z.
 * @param size order n
 * @param luRe real part of the factors
 * @param luIm imaginary part of the factors
 * @param pivots row interchanges from the factorisation
 * @param bRe real part of b, replaced by the solution
 * @param bIm imaginary part of b, replaced by the solution
 */
export function solveComplexLu(
  size: number,
  luRe: Float64Array,
  luIm: Float64Array,
  pivots: Int32Array,
  bRe: Float64Array,
  bIm: Float64Array,
): void {
  for (let k = 0; k < size; k++) {
    const p = pivots[k];
    if (p !== k) {
      let t = bRe[k];
      bRe[k] = bRe[p];
      bRe[p] = t;
      t = bIm[k];
      bIm[k] = bIm[p];
      bIm[p] = t;
    }
  }
  for (let r = 1; r < size; r++) {
    let sr = bRe[r];
    let si = bIm[r];
    const row = r * size;
    for (let c = 0; c < r; c++) {
      const lr = luRe[row + c];
      const li = luIm[row + c];
      sr -= lr * bRe[c] - li * bIm[c];
      si -= lr * bIm[c] + li * bRe[c];
    }
    bRe[r] = sr;
    bIm[r] = si;
  }
  for (let k = size - 1; k >= 0; k--) {
    let sr = bRe[k];
    let si = bIm[k];
    const row = k * size;
    for (let c = k + 1; c < size; c++) {
      const ar = luRe[row + c];
      const ai = luIm[row + c];
      sr -= ar * bRe[c] - ai * bIm[c];
      si -= ar * bIm[c] + ai * bRe[c];
    }
    const pr = luRe[row + k];
    const pi = luIm[row + k];
    const d = pr * pr + pi * pi;
    bRe[k] = (sr * pr + si * pi) / d;
    bIm[k] = (si * pr - sr * pi) / d;
  }
}
