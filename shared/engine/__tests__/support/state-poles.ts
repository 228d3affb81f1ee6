import { EigenvalueDecomposition, Matrix } from "ml-matrix";

/**
 * Test reference: every eigenvalue (re, im) of the state matrix A = [[0, I], [−M⁻¹K, −M⁻¹C]] of
 * M ẍ + C ẋ + K x = 0 with a diagonal M (docs/method-and-validation.md §1), by ml-matrix's EigenvalueDecomposition —
 * independent of the engine's p-k solvers.
 * @param masses the diagonal of M
 * @param stiffness K (n×n rows)
 * @param damping C (n×n rows)
 */
export function statePoles(masses: number[], stiffness: number[][], damping: number[][]): [number, number][] {
  const n = masses.length;
  const a = Matrix.zeros(2 * n, 2 * n);
  for (let i = 0; i < n; i++) {
    a.set(i, n + i, 1);
    for (let j = 0; j < n; j++) {
      a.set(n + i, j, -stiffness[i][j] / masses[i]);
      a.set(n + i, n + j, -damping[i][j] / masses[i]);
    }
  }
  const evd = new EigenvalueDecomposition(a);
  return evd.realEigenvalues.map((re, k) => [re, evd.imaginaryEigenvalues[k]]);
}
