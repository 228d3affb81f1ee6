/**
 * The tracker's step budget. Extreme but valid inputs (mass ratio m/(ρB²) ≈ 2e-10, radius of gyration 1e-6 m on a
 * 1,000 m deck) refine at most intervals; without a budget an earlier tracker took 51,305 steps on this 2,000-interval sweep,
 * and about 23 s on the request thread at 20,000 intervals. The budget bounds the work; the speeds solved
 * without refinement are reported, never hidden.
 */
import { describe, expect, it } from "vitest";
import { runSweep } from "../../run-sweep";
import { SweepStepLimitError } from "../step-limit-error";
import { parseStudy } from "../../../schemas/study";
import { extremeDeck } from "../../__tests__/support/extreme-deck";

const extreme = extremeDeck();

describe("pole tracking budget", () => {
  it("accepts the extreme document as valid input", () => {
    expect(parseStudy(extreme).ok).toBe(true);
  });

  it("takes at most 4 × the grid + 2,000 steps per branch and reports the unresolved speeds", () => {
    const result = runSweep(extreme);
    const grid = 2001;
    for (const mode of result.modes) expect(mode.steps.length).toBeLessThanOrEqual(4 * grid + 2000);
    expect(result.modes[0].steps.length).toBeGreaterThanOrEqual(grid);
    expect(result.warnings.map((w) => w.code)).toContain("tracking-ambiguous");
  });
});

describe("hard limit on solved speeds (stepLimit / maxSolvedSteps)", () => {
  it("stops a sweep whose refinement would pass the limit with a SweepStepLimitError naming it", () => {
    // Without a limit this 2,001-speed grid refines to about 3,100 solved speeds (the budget test above).
    let error: unknown;
    try {
      runSweep(extreme, { maxSolvedSteps: 2500 });
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(SweepStepLimitError);
    expect(error).toBeInstanceOf(RangeError);
    expect((error as SweepStepLimitError).limit).toBe(2500);
    expect((error as Error).message).toContain("more than 2500 solved speeds");
  });

  it("refuses a grid larger than the limit before solving anything", () => {
    // 2,001 grid speeds against a limit of 1,000: refused at the first speed, nothing solved.
    const error = (() => {
      try {
        runSweep(extreme, { maxSolvedSteps: 1000 });
      } catch (err) {
        return err as SweepStepLimitError;
      }
    })();
    expect(error).toBeInstanceOf(SweepStepLimitError);
    expect(error!.message).toContain("more than 1000 solved speeds");
    expect(error!.reachedAtMps).toBe(extreme.sweep.from);
  });

  it("changes nothing when the sweep stays within the limit", () => {
    const small = { ...extreme, sweep: { from: 0, to: 50, step: 0.5 } };
    expect(runSweep(small, { maxSolvedSteps: 100_000 })).toEqual(runSweep(small));
  });
});
