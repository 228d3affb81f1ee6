import type { Pole } from "./refine-pole";
import type { TrackedStep } from "./track-poles";

/** Nodes of the predictor closer together than this fraction of the extrapolation distance are skipped. */
const MIN_NODE_SPACING = 0.1;
/** Steps looked back for well-spaced nodes. */
const LOOK_BACK = 8;

/**
 * Quadratic (Lagrange) extrapolation of a branch's pole in U from its last step and the two nearest earlier steps
 * that lie at least 0.1 × the extrapolation distance apart from the node after them (at most 8 steps back): steps
 * crowded together (a table row visited just next to a grid speed) would make the extrapolation ill-conditioned.
 */
export function predict(steps: TrackedStep[], speed: number): Pole {
  const last = steps[steps.length - 1];
  const pts: TrackedStep[] = [last];
  const spacing = MIN_NODE_SPACING * Math.abs(speed - last.speedMps);
  for (let k = steps.length - 2; k >= 0 && k >= steps.length - 1 - LOOK_BACK && pts.length < 3; k--) {
    if (pts[pts.length - 1].speedMps - steps[k].speedMps >= spacing) pts.push(steps[k]);
  }
  const count = pts.length;
  let re = 0;
  let im = 0;
  for (let a = 0; a < count; a++) {
    let w = 1;
    for (let c = 0; c < count; c++) {
      if (c !== a) w *= (speed - pts[c].speedMps) / (pts[a].speedMps - pts[c].speedMps);
    }
    re += w * pts[a].re;
    im += w * pts[a].im;
  }
  if (last.im === 0) im = 0;
  return { re, im, vecRe: last.vecRe, vecIm: last.vecIm };
}
