import { modalAssurance } from "./mac";
import { optimalAssignment } from "./hungarian";

/** A pole with its eigenvector as seen by the tracker. */
export interface TrackPoint {
  re: number;
  im: number;
  vecRe: Float64Array;
  vecIm: Float64Array;
}

/** Per-branch verdict on one step of the tracker. */
export interface StepAssessment {
  /** MAC of each branch's new eigenvector with its own previous one. */
  readonly mac: Float64Array;
  /** Confidence 0–1 of each branch's assignment (definition below). */
  readonly confidence: Float64Array;
  /** True when the optimal assignment of new to previous vectors is the identity (no branch swapped). */
  readonly identity: boolean;
}

/**
 * Judges whether each branch's newly solved pole really continues that branch.
 *
 * Method: the mass-weighted MAC matrix between previous and new eigenvectors is assigned optimally
 * (Hungarian method on 1 − MAC); a non-identity assignment means two branches swapped or merged. The confidence
 * of branch j is
 *   c_j = MAC_jj · max(s_mac, s_pred),
 *   s_mac  = clamp((MAC_jj − max_{k≠j} MAC(prev_j, new_k)) / 0.5, 0, 1)   — shape separation,
 *   s_pred = clamp(1 − |λ_j − λ̂_j| / (½ δ_j), 0, 1)                      — predictor agreement,
 * with λ̂_j the predicted pole and δ_j the distance from λ_j to the nearest other branch's new pole. A branch is
 * certain when its shape is distinct from every other new shape (s_mac = 1), or when the predictor landed
 * well inside its own half of the gap to the nearest pole (s_pred ≈ 1); close poles with similar shapes
 * (veering) and predictor misses lower it; a shape jump lowers it through MAC_jj.
 * Notes: with a single branch c = MAC_11.
 * @param n degrees of freedom (and branches)
 * @param mass M (n×n)
 * @param previous each branch's previous point
 * @param predicted each branch's predicted pole
 * @param next each branch's newly solved point
 */
export function assessStep(
  n: number,
  mass: Float64Array,
  previous: readonly TrackPoint[],
  predicted: readonly { re: number; im: number }[],
  next: readonly TrackPoint[],
): StepAssessment {
  const b = previous.length;
  const macs = new Float64Array(b * b);
  for (let i = 0; i < b; i++) {
    for (let k = 0; k < b; k++) {
      macs[i * b + k] = modalAssurance(n, mass, previous[i].vecRe, previous[i].vecIm, next[k].vecRe, next[k].vecIm);
    }
  }
  const cost = new Float64Array(b * b);
  for (let i = 0; i < b * b; i++) cost[i] = 1 - macs[i];
  const assign = optimalAssignment(cost, b, b);
  let identity = true;
  for (let i = 0; i < b; i++) if (assign[i] !== i) identity = false;
  const mac = new Float64Array(b);
  const confidence = new Float64Array(b);
  for (let j = 0; j < b; j++) {
    const self = macs[j * b + j];
    let other = 0;
    let gap = Number.POSITIVE_INFINITY;
    for (let k = 0; k < b; k++) {
      if (k === j) continue;
      other = Math.max(other, macs[j * b + k]);
      gap = Math.min(gap, Math.hypot(next[j].re - next[k].re, next[j].im - next[k].im));
    }
    const sMac = b === 1 ? 1 : clamp01((self - other) / 0.5);
    const miss = Math.hypot(next[j].re - predicted[j].re, next[j].im - predicted[j].im);
    const sPred = b === 1 ? 1 : gap > 0 ? clamp01(1 - miss / (0.5 * gap)) : 0;
    mac[j] = self;
    confidence[j] = self * Math.max(sMac, sPred);
  }
  return { mac, confidence, identity };
}

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}
