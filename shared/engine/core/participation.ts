/**
 * Share of each structural degree of freedom in the kinetic energy of a complex mode shape:
 * p_i = M_ii |x_i|² / Σ_k M_kk |x_k|², summing to 1.
 *
 * Method: diagonal kinetic-energy shares (for a section model m|h|² and I|α|²; for generalized coordinates
 * the generalized masses). Notes: with a non-diagonal mass matrix only the diagonal terms are used, so the
 * shares describe the coordinates, not the coupling energy.
 * @param n number of degrees of freedom
 * @param mass M (n×n row-major)
 * @param out receives the shares (length n)
 */
export function kineticParticipation(
  n: number,
  mass: Float64Array,
  re: Float64Array,
  im: Float64Array,
  out: Float64Array,
): Float64Array {
  let total = 0;
  for (let i = 0; i < n; i++) {
    const e = mass[i * n + i] * (re[i] * re[i] + im[i] * im[i]);
    out[i] = e;
    total += e;
  }
  for (let i = 0; i < n; i++) out[i] = total > 0 ? out[i] / total : 1 / n;
  return out;
}
