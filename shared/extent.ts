/**
 * Smallest and largest of `values` ({ min: Infinity, max: -Infinity } when there are none). A loop, because
 * `Math.max(...values)` passes every value as an argument and overflows the call stack past ~100,000 of them
 * (a 125,000-row upload did).
 */
export function extent(values: Iterable<number>): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}
