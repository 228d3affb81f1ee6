/**
 * Thrown by `trackPoles` when a sweep would solve more speeds than its `stepLimit` allows (grid, hidden lead-in
 * and local refinement counted together).
 */
export class SweepStepLimitError extends RangeError {
  override readonly name = "SweepStepLimitError";

  /**
   * @param limit the limit on solved speeds that was reached
   * @param reachedAtMps the last speed solved before stopping, m/s
   */
  constructor(
    readonly limit: number,
    readonly reachedAtMps: number,
  ) {
    super(`the sweep needs more than ${limit} solved speeds (stopped at ${Number(reachedAtMps.toFixed(3))} m/s)`);
  }
}
