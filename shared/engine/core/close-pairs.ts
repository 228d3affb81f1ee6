import type { TrackedStep } from "./track-poles";

/** Samples of the discriminant's model along one step. */
const SAMPLES = 64;

/** The verdict on one pair of branches whose poles came close within a step. */
export interface PairVerdict {
  readonly i: number;
  readonly j: number;
  /** 0–1: how far the modelled discriminant stays from zero against its model error (≥ 0.5 is reliable). */
  readonly confidence: number;
  /** True when the new poles of i and j must be exchanged to continue the branches. */
  readonly swap: boolean;
}

/**
 * Resolves, by continuity, which of two close poles continues which branch — also through a near-exceptional-point
 * veering, where the eigenvectors of the two poles become parallel and MAC and the predictor cannot decide.
 *
 * Method: a pair is close when the poles came nearer to each other than twice the distance either moved during the
 * step. Near each other the two poles are λ = σ ± δ with δ² = D = ((λ_i − λ_j)/2)², and σ and D are smooth in U
 * even where the poles themselves turn sharply (at an exceptional point D = 0). D is modelled through the pair's last
 * accepted steps and the new one (quadratic through three speeds, else linear), its argument followed continuously
 * along the step (64 samples), and δ continued from the previous step by the square root of that path: the new pole
 * on δ's side continues branch i (`swap` says when the two new poles must be exchanged). Confidence = clamp(ρ/4, 0, 1), ρ the
 * closest approach of the modelled D to zero divided by the model's error (|quadratic − linear| on the path, plus
 * 1e-12|λ|² for rounding); below 0.5 the step is refined, and at the smallest step the speed is reported
 * ambiguous (docs/method-and-validation.md §3).
 * Notes: pairs with a static pole are skipped; the decision does not use eigenvectors.
 * @param history each branch's accepted steps (sorted by speed)
 * @param next each branch's newly solved step
 * @returns one verdict per close pair
 */
export function resolveClosePairs(history: readonly TrackedStep[][], next: readonly TrackedStep[]): PairVerdict[] {
  const verdicts: PairVerdict[] = [];
  const b = next.length;
  for (let i = 0; i < b; i++) {
    for (let j = i + 1; j < b; j++) {
      const hi = history[i];
      const hj = history[j];
      if (hi.length === 0 || hj.length === 0) continue;
      const pi = hi[hi.length - 1];
      const pj = hj[hj.length - 1];
      const qi = next[i];
      const qj = next[j];
      if (!(pi.im > 0 && pj.im > 0 && qi.im > 0 && qj.im > 0)) continue;
      const moved = 2 * Math.sqrt(Math.max(squared(qi.re - pi.re, qi.im - pi.im), squared(qj.re - pj.re, qj.im - pj.im)));
      if (closestApproach(pi.re - pj.re, pi.im - pj.im, qi.re - qj.re, qi.im - qj.im) >= moved) continue;
      const older = hi.length > 1 && hj.length > 1 && hi[hi.length - 2].im > 0 && hj[hj.length - 2].im > 0;
      const point = (a: TrackedStep, c: TrackedStep) => {
        const dr = 0.5 * (a.re - c.re);
        const di = 0.5 * (a.im - c.im);
        return { u: a.speedMps, dr, di, re: dr * dr - di * di, im: 2 * dr * di };
      };
      const p = point(pi, pj);
      const q = point(qi, qj);
      const o = older ? point(hi[hi.length - 2], hj[hj.length - 2]) : null;
      const scale = Math.max(Math.hypot(pi.re, pi.im), Math.hypot(qi.re, qi.im)) ** 2;
      let theta = 2 * Math.atan2(p.di, p.dr);
      let lastArg = Math.atan2(p.im, p.re);
      let nearest = Number.POSITIVE_INFINITY;
      let error = 0;
      let smooth = true;
      for (let s = 1; s <= SAMPLES; s++) {
        const u = p.u + ((q.u - p.u) * s) / SAMPLES;
        const t = (u - p.u) / (q.u - p.u);
        // linear model, plus the quadratic correction through the older point
        let re = p.re + t * (q.re - p.re);
        let im = p.im + t * (q.im - p.im);
        if (o) {
          const w = ((u - p.u) * (u - q.u)) / ((o.u - p.u) * (o.u - q.u));
          const cr = (o.re - (p.re + ((o.u - p.u) / (q.u - p.u)) * (q.re - p.re))) * w;
          const ci = (o.im - (p.im + ((o.u - p.u) / (q.u - p.u)) * (q.im - p.im))) * w;
          re += cr;
          im += ci;
          error = Math.max(error, Math.hypot(cr, ci));
        }
        nearest = Math.min(nearest, Math.hypot(re, im));
        const arg = Math.atan2(im, re);
        let step = arg - lastArg;
        if (step > Math.PI) step -= 2 * Math.PI;
        if (step < -Math.PI) step += 2 * Math.PI;
        if (Math.abs(step) > Math.PI / 2) smooth = false;
        theta += step;
        lastArg = arg;
      }
      if (!o) error = Math.hypot(q.re - p.re, q.im - p.im);
      const ratio = smooth ? nearest / (error + 1e-12 * scale) : 0;
      // δ continued along the path against the new δ = (q_i − q_j)/2
      const size = Math.sqrt(Math.hypot(q.re, q.im));
      const cr = size * Math.cos(theta / 2);
      const ci = size * Math.sin(theta / 2);
      const swap = Math.hypot(cr + q.dr, ci + q.di) < Math.hypot(cr - q.dr, ci - q.di);
      verdicts.push({ i, j, confidence: Math.min(1, Math.max(0, ratio / 4)), swap });
    }
  }
  return verdicts;
}

const squared = (re: number, im: number) => re * re + im * im;

/** Smallest |a(1 − t) + c t| over t ∈ [0, 1] for complex a = ar + i·ai, c = cr + i·ci (ends included). */
function closestApproach(ar: number, ai: number, cr: number, ci: number): number {
  const dr = cr - ar;
  const di = ci - ai;
  const dd = dr * dr + di * di;
  const t = dd > 0 ? Math.min(1, Math.max(0, -(ar * dr + ai * di) / dd)) : 0;
  return Math.sqrt(squared(ar + t * dr, ai + t * di));
}
