import { optimalAssignment } from "./hungarian";
import { modalAssurance } from "./mac";
import type { Pole } from "./refine-pole";

/**
 * Optimal assignment of candidate poles (from a full decomposition) to tracked branches.
 *
 * Method: cost(i, c) = (1 − MAC(ref_i, x_c)) + min(1, |λ_c − λ̂_i| / s_i), minimised over all assignments by the
 * Hungarian method; λ̂_i is branch i's predicted pole and s_i = max(4|λ̂_i − λ_prev,i|, 1e-3|λ̂_i|) a distance
 * scale from the predictor's own step (infinite without a previous step: shape only).
 * Notes: with more candidates than branches (real pairs count twice) the extra candidates stay unassigned.
 * @param n degrees of freedom
 * @param mass M (n×n), for the mass-weighted MAC
 * @param refs each branch's reference eigenvector
 * @param pred each branch's predicted pole
 * @param poles candidates
 * @param prev each branch's previous pole, or null at the start
 * @returns the candidate index assigned to each branch
 */
/** Above every finite cost (1 − MAC ≤ 1, distance term ≤ 1). */
const WORST_COST = 3;

export function assignPoles(n: number, mass: Float64Array, refs: Pole[], pred: Pole[], poles: Pole[], prev: Pole[] | null): Int32Array {
  const b = refs.length;
  const m = poles.length;
  const cost = new Float64Array(b * m);
  for (let i = 0; i < b; i++) {
    const scale = prev
      ? Math.max(4 * Math.hypot(pred[i].re - prev[i].re, pred[i].im - prev[i].im), 1e-3 * Math.hypot(pred[i].re, pred[i].im), 1e-12)
      : Number.POSITIVE_INFINITY;
    for (let c = 0; c < m; c++) {
      const mac = modalAssurance(n, mass, refs[i].vecRe, refs[i].vecIm, poles[c].vecRe, poles[c].vecIm);
      const dist = Math.hypot(poles[c].re - pred[i].re, poles[c].im - pred[i].im) / scale;
      const c_ic = 1 - mac + Math.min(1, dist);
      // A pole or shape that overflowed to NaN (absurd inputs) is the worst possible match, never a hang.
      cost[i * m + c] = Number.isFinite(c_ic) ? c_ic : WORST_COST;
    }
  }
  return optimalAssignment(cost, b, m);
}
