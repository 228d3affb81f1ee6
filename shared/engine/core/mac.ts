/**
 * Modal assurance criterion between two complex displacement vectors, weighted by the mass matrix:
 * MAC = |aᴴ M b|² / ((aᴴ M a)(bᴴ M b)), between 0 (orthogonal) and 1 (same shape).
 *
 * Method: direct evaluation; the mass weighting makes the criterion independent of the units of mixed
 * coordinates (metres of heave against radians of rotation) — it correlates kinetic-energy shapes
 * (Allemang & Brown 1982, "A correlation coefficient for modal vector analysis", Proc. 1st IMAC; the weighted
 * form is common practice).
 * Notes: invariant to the scale and phase of either vector; returns 0 when either vector is zero.
 * @param n number of degrees of freedom
 * @param mass M (n×n row-major)
 * @returns MAC in [0, 1]
 */
export function modalAssurance(
  n: number,
  mass: Float64Array,
  aRe: Float64Array,
  aIm: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
): number {
  let abr = 0, abi = 0, aa = 0, bb = 0;
  for (let i = 0; i < n; i++) {
    let mbr = 0, mbi = 0, mar = 0, mai = 0;
    const row = i * n;
    for (let j = 0; j < n; j++) {
      const w = mass[row + j];
      if (w === 0) continue;
      mbr += w * bRe[j];
      mbi += w * bIm[j];
      mar += w * aRe[j];
      mai += w * aIm[j];
    }
    // conj(a_i) * (M b)_i
    abr += aRe[i] * mbr + aIm[i] * mbi;
    abi += aRe[i] * mbi - aIm[i] * mbr;
    aa += aRe[i] * mar + aIm[i] * mai;
    bb += bRe[i] * mbr + bIm[i] * mbi;
  }
  if (!(aa > 0) || !(bb > 0)) return 0;
  return Math.min(1, (abr * abr + abi * abi) / (aa * bb));
}
