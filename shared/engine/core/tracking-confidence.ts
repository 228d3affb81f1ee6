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
  /** The optimal assignment: the new pole assigned to each previous branch. */
  readonly assignment: Int32Array;
  /** Shape separation s_mac of each branch (1: its new shape is clearly distinct from every other new shape). */
  readonly separation: Float64Array;
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
 * (veering) and predictor misses lower it; a shape jump lowers it through MAC_jj. For a branch whose pole pair
 * has just reached the real axis (where the p-k solution can jump to a real root at a fold of its fixed point)
 * s_pred is 1 when the real root is nearer to the branch's own previous pole than to any other branch's, else 0.
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
  const macs = macMatrix(n, mass, previous, next);
  const cost = new Float64Array(b * b);
  for (let i = 0; i < b * b; i++) cost[i] = 1 - macs[i];
  const assign = optimalAssignment(cost, b, b);
  let identity = true;
  for (let i = 0; i < b; i++) if (assign[i] !== i) identity = false;
  const mac = new Float64Array(b);
  const confidence = new Float64Array(b);
  const separation = new Float64Array(b);
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
    let sPred = b === 1 ? 1 : gap > 0 ? clamp01(1 - miss / (0.5 * gap)) : 0;
    if (b > 1 && previous[j].im > 0 && next[j].im === 0) {
      // the pair has just reached the real axis, where the p-k solution may jump (a fold of the fixed point):
      // judged by nearest previous pole instead of by the predictor
      const own = Math.hypot(next[j].re - previous[j].re, previous[j].im);
      let nearest = true;
      for (let k = 0; k < b; k++) {
        if (k !== j && Math.hypot(next[j].re - previous[k].re, previous[k].im) <= own) nearest = false;
      }
      sPred = nearest ? 1 : 0;
    }
    mac[j] = self;
    separation[j] = sMac;
    confidence[j] = self * Math.max(sMac, sPred);
  }
  return { mac, confidence, identity, assignment: assign, separation };
}

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}

/**
 * All MACs between two sets of vectors, forming M·b once per new vector (n³ instead of n⁴ work); same
 * definition as `modalAssurance`.
 */
function macMatrix(n: number, mass: Float64Array, a: readonly TrackPoint[], b: readonly TrackPoint[]): Float64Array {
  const na = a.length;
  const nb = b.length;
  const mbRe = new Float64Array(nb * n);
  const mbIm = new Float64Array(nb * n);
  const bb = new Float64Array(nb);
  const aa = new Float64Array(na);
  for (let k = 0; k < nb; k++) {
    const { vecRe, vecIm } = b[k];
    let norm = 0;
    for (let i = 0; i < n; i++) {
      let r = 0;
      let m = 0;
      const row = i * n;
      for (let j = 0; j < n; j++) {
        const w = mass[row + j];
        if (w === 0) continue;
        r += w * vecRe[j];
        m += w * vecIm[j];
      }
      mbRe[k * n + i] = r;
      mbIm[k * n + i] = m;
      norm += vecRe[i] * r + vecIm[i] * m;
    }
    bb[k] = norm;
  }
  for (let i = 0; i < na; i++) {
    const { vecRe, vecIm } = a[i];
    let norm = 0;
    for (let r = 0; r < n; r++) {
      let s = 0;
      let t = 0;
      const row = r * n;
      for (let j = 0; j < n; j++) {
        const w = mass[row + j];
        if (w === 0) continue;
        s += w * vecRe[j];
        t += w * vecIm[j];
      }
      norm += vecRe[r] * s + vecIm[r] * t;
    }
    aa[i] = norm;
  }
  const out = new Float64Array(na * nb);
  for (let i = 0; i < na; i++) {
    const { vecRe, vecIm } = a[i];
    for (let k = 0; k < nb; k++) {
      let re = 0;
      let im = 0;
      const off = k * n;
      for (let r = 0; r < n; r++) {
        re += vecRe[r] * mbRe[off + r] + vecIm[r] * mbIm[off + r];
        im += vecRe[r] * mbIm[off + r] - vecIm[r] * mbRe[off + r];
      }
      out[i * nb + k] = aa[i] > 0 && bb[k] > 0 ? Math.min(1, (re * re + im * im) / (aa[i] * bb[k])) : 0;
    }
  }
  return out;
}
