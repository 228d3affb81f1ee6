import { MAX_SWEEP_STEPS, sweepStepCount } from "../schemas/study";

/**
 * The wind speeds of a sweep: from, from + step, …, ending exactly at `to`.
 *
 * Method: count = ceil((to − from)/step) intervals (with the schema's 1e-9 tolerance for decimal steps);
 * speeds are from + i·step (computed by multiplication, no accumulated rounding) and the last one is `to`.
 * Notes: throws when the grid is empty or longer than the format's limit.
 * @param fromMps first speed, m/s (≥ 0)
 * @param toMps last speed, m/s (> from)
 * @param stepMps step, m/s (> 0)
 * @returns increasing speeds, m/s
 */
export function sweepGrid(fromMps: number, toMps: number, stepMps: number): number[] {
  if (!(fromMps >= 0) || !(toMps > fromMps) || !(stepMps > 0)) {
    throw new RangeError(`sweep: need 0 ≤ from < to and step > 0 (got ${fromMps}, ${toMps}, ${stepMps})`);
  }
  const count = sweepStepCount({ from: fromMps, to: toMps, step: stepMps });
  if (count > MAX_SWEEP_STEPS) throw new RangeError(`sweep: ${count} steps exceed the limit of ${MAX_SWEEP_STEPS}`);
  const speeds: number[] = [];
  for (let i = 0; i < count; i++) speeds.push(fromMps + i * stepMps);
  speeds.push(toMps);
  return speeds;
}
