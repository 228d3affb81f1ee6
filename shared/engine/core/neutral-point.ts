import { brentRoot } from "./brent-root";
import type { ModalSystem } from "./modal-system";
import { normalizeModeVector } from "./mode-vector";
import { createHarmonicWorkspace, speedRootAt, type SpeedRoot } from "./speed-eigenvalue";
import { assertScanlanScaling } from "./unit-speed-aero";

/** A neutral point of the aeroelastic system: undamped harmonic motion at a real speed and frequency. */
export interface NeutralPoint {
  readonly speedMps: number;
  readonly omegaRadS: number;
  /** K = L_ref ω / U. */
  readonly reducedFrequency: number;
  /** Harmonic mode x (complex, unit kinetic norm). */
  readonly vecRe: Float64Array;
  readonly vecIm: Float64Array;
}

export interface NeutralPointOptions {
  /** Largest relative change of K searched on either side of the start (default 0.25). */
  readonly span?: number;
  /** Ratio between neighbouring K of the march (default 1.0025). */
  readonly ratio?: number;
}

/** |Im U| / |U| accepted as a real speed at the end of the search. */
const REAL_SPEED_TOLERANCE = 1e-8;

/**
 * The neutral point next to a starting speed and frequency: real U > 0 and ω > 0 with det Z(U, ω) = 0, the harmonic
 * flutter determinant (Theodorsen's classical route, solved for real (U, ω)), for any number of modes.
 *
 * Method: at fixed reduced frequency K the determinant is a quadratic eigenvalue problem in U (`speedRootAt`); the
 * root continued from the start (U₀, K₀ = L ω₀/U₀) is followed in K by warm starts, marching from K₀ outwards on
 * both sides at once (factor 1.0025 per step, up to ±25 %), until Im U changes sign; Brent's method on Im U/|U|
 * (`brentRoot`) then locates K*, and U* = Re U(K*), ω* = K*·U* / L. The nearest sign change in K is taken.
 * Notes: null when no sign change lies within the span, when the continued root stops converging, or when the
 * root at the end is not real and positive (|Im U| > 1e-8 |U|). Used where the p-k branch folds
 * (docs/method-and-validation.md §4); the test suite checks it against an independent determinant route.
 * @param system the n-mode system (Scanlan-form aerodynamics)
 * @param start speed (m/s), circular frequency (rad/s) and mode (complex vector) to start from
 * @param options span and ratio of the march in K
 * @returns the neutral point, or null
 */
export function solveNeutralPoint(
  system: ModalSystem,
  start: { speedMps: number; omegaRadS: number; vecRe: Float64Array; vecIm: Float64Array },
  options: NeutralPointOptions = {},
): NeutralPoint | null {
  const n = system.size;
  const L = system.referenceLengthM;
  if (!system.hasAero || !(start.speedMps > 0) || !(start.omegaRadS > 0)) return null;
  assertScanlanScaling(system);
  const work = createHarmonicWorkspace(n);
  const ratio = options.ratio ?? 1.0025;
  const steps = Math.ceil(Math.log(1 + (options.span ?? 0.25)) / Math.log(ratio));
  const k0 = (L * start.omegaRadS) / start.speedMps;
  const copy = (r: SpeedRoot): SpeedRoot => ({ re: r.re, im: r.im, vecRe: Float64Array.from(r.vecRe), vecIm: Float64Array.from(r.vecIm) });
  const first: SpeedRoot = { re: start.speedMps, im: 0, vecRe: Float64Array.from(start.vecRe), vecIm: Float64Array.from(start.vecIm) };
  if (!speedRootAt(system, k0, first, work)) return null;
  const g = (r: SpeedRoot) => r.im / Math.hypot(r.re, r.im);
  type End = { k: number; root: SpeedRoot; g: number; alive: boolean };
  const sides: End[] = [-1, 1].map(() => ({ k: k0, root: copy(first), g: g(first), alive: true }));
  let bracket: [End, End] | null = g(first) === 0 ? [sides[0], sides[0]] : null;
  for (let i = 1; i <= steps && !bracket; i++) {
    for (const [s, side] of sides.entries()) {
      if (!side.alive || bracket) continue;
      const k = side.k * (s === 0 ? 1 / ratio : ratio);
      const root = copy(side.root);
      if (!(k >= system.minReducedFrequency) || !speedRootAt(system, k, root, work)) {
        side.alive = false;
        continue;
      }
      const next: End = { k, root, g: g(root), alive: true };
      if (root.re > 0 && side.root.re > 0 && Math.sign(next.g) !== Math.sign(side.g)) bracket = [side, next];
      sides[s] = next;
    }
  }
  if (!bracket) return null;
  const [a, b] = bracket;
  let found = copy(a.root);
  let kStar = a.k;
  if (a !== b) {
    const evaluate = (k: number) => {
      const from = Math.abs(k - a.k) <= Math.abs(k - b.k) ? a : b;
      const root = copy(from.root);
      if (!speedRootAt(system, k, root, work)) return from.g;
      found = root;
      kStar = k;
      return g(root);
    };
    const k = brentRoot(evaluate, a.k, b.k, a.g, b.g, 1e-13 * k0);
    if (k !== kStar) evaluate(k);
  }
  if (!(found.re > 0) || Math.abs(g(found)) > REAL_SPEED_TOLERANCE) return null;
  normalizeModeVector(n, system.mass, found.vecRe, found.vecIm);
  return {
    speedMps: found.re,
    omegaRadS: (kStar * found.re) / L,
    reducedFrequency: kStar,
    vecRe: found.vecRe,
    vecIm: found.vecIm,
  };
}
