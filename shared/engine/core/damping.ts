/** A damping ratio above −1e-9 counts as not yet unstable (rounding on undamped, still-air systems). */
export const DAMPING_TOLERANCE = 1e-9;

/** Damping ratio ζ = −Re λ / |λ| of a pole (0 at λ = 0). */
export function dampingRatio(re: number, im: number): number {
  const modulus = Math.sqrt(re * re + im * im);
  return modulus > 0 ? -re / modulus : 0;
}

/**
 * Where the quadratic through three (speed, damping) points has its minimum inside (u1, u2) below −1e-9 while the
 * ends are not unstable: the speed of that minimum, else null. The local model of the damping between two accepted
 * steps (docs/method-and-validation.md §3, "missed windows").
 * @param u0 first speed (the extra point, on either side), m/s
 * @param z0 damping ratio there
 * @param u1 left end of the interval
 * @param z1 damping ratio there
 * @param u2 right end of the interval
 * @param z2 damping ratio there
 */
export function dampingDip(u0: number, z0: number, u1: number, z1: number, u2: number, z2: number): number | null {
  if (z1 < -DAMPING_TOLERANCE || z2 < -DAMPING_TOLERANCE) return null;
  // Newton form through (u1, z1), (u2, z2), (u0, z0): z = z1 + s(u − u1) + c(u − u1)(u − u2)
  const s = (z2 - z1) / (u2 - u1);
  const c = ((z0 - z1) / (u0 - u1) - s) / (u0 - u2);
  if (!(c > 0) || !Number.isFinite(c)) return null;
  const at = 0.5 * (u1 + u2) - s / (2 * c);
  if (!(at > u1 && at < u2)) return null;
  const value = z1 + s * (at - u1) + c * (at - u1) * (at - u2);
  return value < -DAMPING_TOLERANCE ? at : null;
}
