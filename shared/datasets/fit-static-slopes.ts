import type { StaticRow } from "./read-static-coefficients-csv";

export interface StaticSlopes {
  window: { fromDeg: number; toDeg: number };
  pointCount: number;
  dragCoefficientOnB: number;
  liftCoefficient: number;
  momentCoefficient: number;
  dragSlopePerRad: number;
  liftSlopePerRad: number;
  momentSlopePerRad: number;
}

/** Least-squares line y = a + b·x: value at x = 0 and slope. */
function line(x: number[], y: number[]): { at0: number; slope: number } {
  const n = x.length;
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
  }
  const slope = sxy / sxx;
  return { at0: my - slope * mx, slope };
}

/**
 * Static coefficients and their slopes at 0° by a least-squares straight line through the rows whose angle
 * lies in the window (ends included).
 *
 * **Method**: ordinary least squares per coefficient; slopes per degree × 180/π give per radian.
 * **Notes**: rows must already have C_D on B. Needs at least 2 distinct angles in the window; returns the
 * number found otherwise. The fit is only as linear as the data in the window — keep it narrow around 0°.
 * @param rows - angle (degrees) and coefficients, C_D on ½ρU²B
 * @param window - fitting window, degrees
 * @returns values at 0° (dimensionless) and slopes (per radian), or the count of rows found
 */
export function fitStaticSlopes(
  rows: readonly StaticRow[],
  window: { fromDeg: number; toDeg: number },
): { ok: true; slopes: StaticSlopes } | { ok: false; pointCount: number } {
  const inside = rows.filter((r) => r.angleDeg >= window.fromDeg && r.angleDeg <= window.toDeg);
  if (inside.length < 2) return { ok: false, pointCount: inside.length };
  const x = inside.map((r) => r.angleDeg);
  const perRad = 180 / Math.PI;
  const cd = line(x, inside.map((r) => r.CD));
  const cl = line(x, inside.map((r) => r.CL));
  const cm = line(x, inside.map((r) => r.CM));
  return {
    ok: true,
    slopes: {
      window: { ...window },
      pointCount: inside.length,
      dragCoefficientOnB: cd.at0,
      liftCoefficient: cl.at0,
      momentCoefficient: cm.at0,
      dragSlopePerRad: cd.slope * perRad,
      liftSlopePerRad: cl.slope * perRad,
      momentSlopePerRad: cm.slope * perRad,
    },
  };
}
