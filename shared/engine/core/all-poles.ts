import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import type { PoleWorkspace } from "./quadratic-operator";
import { refinePole, type Pole } from "./refine-pole";

/**
 * Every pole of the upper half-plane (Im λ ≥ 0, real poles included) of the quadratic eigenproblem
 * (λ²M + λC + K) x = 0 at one assembled (U, K), with the displacement part of each eigenvector.
 *
 * Method: the first-order state matrix A = [[0, I], [−M⁻¹K, −M⁻¹C]] (2n×2n) is decomposed with ml-matrix's
 * EigenvalueDecomposition (Hessenberg reduction + shifted QR, the JAMA/EISPACK hqr2 algorithm); the
 * eigenvector of a complex pair at columns k, k+1 is V[:,k] + i·V[:,k+1] (JAMA layout). Each pole is then
 * polished by `refinePole` so that full and warm-started solves agree to rounding.
 * Notes: used at the first speed and where tracking is ambiguous; the per-branch Newton path is much
 * cheaper. A real pole with Im λ = 0 is returned once per real root. A state matrix with an entry that is not
 * finite or exceeds ±MAX_STATE_ENTRY throws a RangeError before the QR iteration (which has no cap of its own).
 * @param mass M (n×n)
 * @param massInverse M⁻¹ (n×n)
 * @param work workspace with the assembled C (`dampTot`) and K (`stiffTot`)
 * @returns poles sorted by nothing in particular (the caller assigns them)
 */
/** Largest |entry| of the state matrix handed to the QR algorithm (see `allPoles`). */
export const MAX_STATE_ENTRY = 1e150;

export function allPoles(mass: Float64Array, massInverse: Float64Array, work: PoleWorkspace): Pole[] {
  const n = work.n;
  const a = Matrix.zeros(2 * n, 2 * n);
  for (let i = 0; i < n; i++) {
    a.set(i, n + i, 1);
    for (let j = 0; j < n; j++) {
      let mk = 0;
      let mc = 0;
      for (let l = 0; l < n; l++) {
        mk += massInverse[i * n + l] * work.stiffTot[l * n + j];
        mc += massInverse[i * n + l] * work.dampTot[l * n + j];
      }
      a.set(n + i, j, -mk);
      a.set(n + i, n + j, -mc);
    }
  }
  // ml-matrix's shifted QR (hqr2) has no iteration cap: a NaN or an entry near overflow makes it loop forever.
  // Physical inputs stay many orders of magnitude below this bound.
  for (let i = 0; i < 2 * n; i++) {
    for (let j = 0; j < 2 * n; j++) {
      const x = a.get(i, j);
      if (!(Math.abs(x) <= MAX_STATE_ENTRY)) {
        throw new RangeError(
          `the state matrix has an entry of ${x} (row ${i + 1}, column ${j + 1}); entries must be finite and within ±${MAX_STATE_ENTRY}: ` +
            "mass, inertia, width, frequencies or aerodynamic coefficients are outside any physical range",
        );
      }
    }
  }
  const evd = new EigenvalueDecomposition(a, { assumeSymmetric: false });
  const wr = evd.realEigenvalues;
  const wi = evd.imaginaryEigenvalues;
  const v = evd.eigenvectorMatrix;
  const poles: Pole[] = [];
  for (let k = 0; k < 2 * n; k++) {
    if (wi[k] < 0) continue;
    const start: Pole = { re: wr[k], im: wi[k], vecRe: new Float64Array(n), vecIm: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      start.vecRe[i] = v.get(i, k);
      start.vecIm[i] = wi[k] > 0 ? v.get(i, k + 1) : 0;
    }
    const polished: Pole = { re: 0, im: 0, vecRe: new Float64Array(n), vecIm: new Float64Array(n) };
    work.factored = false;
    const ok = refinePole(mass, work, start.re, start.im, start.vecRe, start.vecIm, polished);
    const close = Math.hypot(polished.re - start.re, polished.im - start.im) <= 1e-6 * Math.hypot(start.re, start.im) + 1e-12;
    poles.push(ok && close ? polished : start);
    if (wi[k] > 0) k++;
  }
  return poles;
}
