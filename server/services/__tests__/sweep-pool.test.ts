import { afterAll, afterEach, describe, expect, it } from "vitest";
import { benchmarkDeck } from "../../../shared/engine/__tests__/support/benchmark-deck.js";
import { runSweep } from "../../../shared/engine/run-sweep.js";
import { parseStudy, type StudyDocument } from "../../../shared/schemas/study.js";
import { AppError } from "../../errors.js";
import { closeSweepPool, runSweepInPool } from "../sweep-pool.js";

function study(sweep: { from: number; to: number; step: number }): StudyDocument {
  const parsed = parseStudy(benchmarkDeck(sweep));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.study;
}

afterEach(() => {
  delete process.env.STILLSPAN_SWEEP_TIMEOUT_MS;
});
afterAll(() => closeSweepPool());

describe("sweep worker pool", () => {
  it("returns exactly runSweep's result for the benchmark deck (IABSE TG 3.1 inputs, docs/conventions.md §Benchmark deck: 77.24 m/s)", async () => {
    const doc = study({ from: 10, to: 100, step: 1 });
    const pooled = await runSweepInPool(doc);
    expect(pooled).toEqual(runSweep(doc));
    expect(Math.abs(pooled.flutter!.speed - 77.24) / 77.24).toBeLessThan(1e-3);
  }, 30_000);

  it("keeps the calling thread free while a sweep runs: timers fire before the sweep answers", async () => {
    const doc = study({ from: 0, to: 400, step: 0.02 }); // 20 000 steps, the format's maximum
    let ticks = 0;
    const timer = setInterval(() => ticks++, 1);
    let ticksWhenDone = -1;
    const done = runSweepInPool(doc).then((r) => {
      ticksWhenDone = ticks;
      return r;
    });
    // While the sweep is running in the worker, this thread keeps serving timers.
    await new Promise((resolve) => setTimeout(resolve, 50));
    const ticksAt50ms = ticks;
    const result = await done;
    clearInterval(timer);
    // An in-process (blocking) run would answer before the first tick.
    expect(ticksAt50ms).toBeGreaterThan(0);
    expect(ticksWhenDone).toBeGreaterThan(0);
    expect(result.modes[0].steps.length).toBeGreaterThanOrEqual(20_001);
  }, 60_000);

  it("stops a sweep over the time limit (STILLSPAN_SWEEP_TIMEOUT_MS) with a 422 naming the limit, then keeps working", async () => {
    process.env.STILLSPAN_SWEEP_TIMEOUT_MS = "5";
    const err = await runSweepInPool(study({ from: 0, to: 400, step: 0.02 })).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(422);
    expect((err as AppError).code).toBe("sweep_timeout");
    expect((err as AppError).message).toContain("time limit of 5 ms");
    delete process.env.STILLSPAN_SWEEP_TIMEOUT_MS;
    const doc = study({ from: 10, to: 100, step: 1 });
    expect(await runSweepInPool(doc)).toEqual(runSweep(doc));
  }, 60_000);
});
