/** Throws a RangeError naming the input when `value` is not a finite number greater than 0. */
export function requirePositive(name: string, value: number): void {
  if (!(Number.isFinite(value) && value > 0)) {
    throw new RangeError(`${name} must be a number greater than 0 (got ${value})`);
  }
}

/** Logarithmic decrement from a viscous damping ratio, δ = 2πζ (small-damping relation). */
export function logDecrementFromDampingRatio(dampingRatio: number): number {
  if (!(Number.isFinite(dampingRatio) && dampingRatio >= 0 && dampingRatio < 1)) {
    throw new RangeError(`damping ratio must lie in [0, 1) (got ${dampingRatio})`);
  }
  return 2 * Math.PI * dampingRatio;
}
