import { modalAssurance } from "./mac";
import type { ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import { STATIC_IM_TOLERANCE } from "./pk-branch";
import { assembleQuadratic, type PoleWorkspace } from "./quadratic-operator";
import type { Pole } from "./refine-pole";
import type { TrackedStep } from "./track-poles";

/**
 * Puts each branch whose pole pair has just reached the real axis on the right real root.
 *
 * Method: a pair reaching the real axis splits into two real roots; the branch continues on the larger one — the
 * root that can cross zero (static instability). Newton from the predictor may have landed on either, or on
 * another branch's real root, so the real poles of a full decomposition at K = K_floor (ω = 0) are screened:
 * poles held by another branch are excluded, those whose mass-weighted MAC with the branch's last eigenvector is
 * at least half the best are candidates, and the largest candidate is taken (eigenvector renormalised).
 * The side of its pair the branch is on — sign(d/dλ det Q) at the root, (−1)^(number of real roots above it) since
 * det Q(λ) → +∞ as λ → +∞ — is returned for the continuity test of real roots (`keepStaticContinuity`).
 * Notes: only steps with previous Im λ > 0 and new Im λ = 0 are touched; one full decomposition per transition.
 * @param system the n-mode system
 * @param work workspace (re-assembled here)
 * @param fullPoles full decomposition of the currently assembled pencil
 * @param steps the newly solved steps, modified in place
 * @param prev each branch's previous pole
 * @param sides receives ±1 for each branch that was settled here (others untouched)
 */
export function settleStaticTransition(
  system: ModalSystem,
  work: PoleWorkspace,
  fullPoles: () => Pole[],
  steps: TrackedStep[],
  prev: readonly Pole[],
  sides?: Int8Array,
): void {
  const n = system.size;
  const mass = system.mass;
  steps.forEach((s, j) => {
    if (!(prev[j].im > 0) || s.im !== 0) return;
    const k = assembleQuadratic(system, s.speedMps, 0, work);
    const held = (p: Pole) =>
      steps.some((o, i) => i !== j && Math.hypot(o.re - p.re, o.im - p.im) <= 1e-6 * Math.hypot(p.re, p.im) + 1e-300);
    const all = fullPoles().filter((p) => Math.abs(p.im) <= STATIC_IM_TOLERANCE * Math.hypot(p.re, p.im));
    const reals = all.filter((p) => !held(p));
    if (reals.length === 0) return;
    const macs = reals.map((p) => modalAssurance(n, mass, prev[j].vecRe, prev[j].vecIm, p.vecRe, p.vecIm));
    const best = Math.max(...macs);
    let chosen: Pole | null = null;
    for (let i = 0; i < reals.length; i++) {
      if (macs[i] >= 0.5 * best && (chosen === null || reals[i].re > chosen.re)) chosen = reals[i];
    }
    if (chosen === null) return;
    const root = chosen.re;
    if (sides) sides[j] = all.filter((p) => p.re > root).length % 2 === 0 ? 1 : -1;
    s.re = chosen.re;
    s.im = 0;
    s.vecRe = Float64Array.from(chosen.vecRe);
    s.vecIm = new Float64Array(n);
    normalizeModeVector(n, mass, s.vecRe, s.vecIm);
    s.reducedFrequency = k;
  });
}
