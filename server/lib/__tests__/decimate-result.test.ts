import { describe, expect, it } from "vitest";
import { benchmarkDeck } from "../../../shared/engine/__tests__/support/benchmark-deck.js";
import { denseTableDeck } from "../../../shared/engine/__tests__/support/extreme-deck.js";
import { runSweep } from "../../../shared/engine/run-sweep.js";
import { sweepResultSchema, type SweepResult, type SweepStep } from "../../../shared/schemas/result.js";
import { decimateResult, maxShownSteps } from "../decimate-result.js";

const step = (speed: number, damping: number, frequency = 0.2): SweepStep => ({
  speed,
  frequency,
  damping,
  re: -damping * 2 * Math.PI * frequency,
  im: 2 * Math.PI * frequency,
  participation: { h: 0.5, a: 0.5 },
  mac: 1,
  confidence: 1,
});

/** Invented branches over 20,001 speeds: `a` crosses zero damping at 123.45 m/s, `h` stays damped. */
function synthetic(): SweepResult {
  const speeds = Array.from({ length: 20_001 }, (_, i) => i * 0.02);
  return {
    flutter: { speed: 123.45, frequency: 0.2, mode: "a", reducedVelocity: 20, kind: "coupled" },
    divergence: null,
    selberg: null,
    modes: [
      { id: "h", steps: speeds.map((u) => step(u, 0.01 + u / 1000)) },
      { id: "a", steps: speeds.map((u) => step(u, (123.45 - u) / 5000)) },
    ],
    warnings: [{ code: "tracking-ambiguous", message: "invented", speeds: speeds.slice(0, 1000) }],
    engine: "test",
  };
}

describe("decimateResult", () => {
  it("keeps a short result whole and says so", () => {
    const full = runSweep(benchmarkDeck({ from: 10, to: 100, step: 1 }));
    const shown = decimateResult(full);
    expect(shown).toEqual({ ...full, sampling: { solvedSteps: 91, shownSteps: 91, maxShownSteps: 2000 } });
    expect(sweepResultSchema.parse(shown)).toEqual(shown);
  });

  it("thins 20,001 steps to at most 2,000 per branch, the same speeds on each, every kept step a solved one", () => {
    const full = synthetic();
    const shown = decimateResult(full);
    const speeds = shown.modes[0].steps.map((s) => s.speed);
    expect(speeds.length).toBeLessThanOrEqual(2000);
    expect(speeds.length).toBeGreaterThan(1900);
    expect(shown.modes[1].steps.map((s) => s.speed)).toEqual(speeds);
    expect(speeds).toEqual([...speeds].sort((x, y) => x - y));
    expect(new Set(speeds).size).toBe(speeds.length);
    for (const [j, mode] of shown.modes.entries()) {
      const solved = new Set(full.modes[j].steps);
      expect(mode.steps.every((s) => solved.has(s))).toBe(true);
    }
    expect(shown.sampling).toEqual({ solvedSteps: 20_001, shownSteps: speeds.length, maxShownSteps: 2000 });
  });

  it("keeps the first and last speed and the solved steps on both sides of the flutter crossing", () => {
    const full = synthetic();
    const shown = decimateResult(full);
    const speeds = shown.modes[0].steps.map((s) => s.speed);
    expect(speeds[0]).toBe(0);
    expect(speeds.at(-1)).toBe(400);
    // 123.45 m/s lies between the solved speeds 123.44 (index 6172) and 123.46: the steps around it are all kept.
    for (let k = 6163; k <= 6182; k++) expect(speeds).toContain(full.modes[0].steps[k].speed);
    const damping = shown.modes[1].steps.map((s) => s.damping);
    const crossing = damping.findIndex((d) => d < 0);
    expect(speeds[crossing - 1]).toBeCloseTo(123.44, 10);
    expect(speeds[crossing]).toBeCloseTo(123.46, 10);
  });

  it("lists at most 200 speeds per warning and gives their number", () => {
    const shown = decimateResult(synthetic());
    expect(shown.warnings[0].speeds).toHaveLength(200);
    expect(shown.warnings[0].speedCount).toBe(1000);
  });

  it("keeps a heavy sweep's answer under 2 MB: about 36,000 solved speeds per branch (10,000-row table, step 0.025 m/s)", () => {
    const full = runSweep(denseTableDeck(0.025));
    const shown = decimateResult(full);
    expect(full.modes[0].steps.length).toBeGreaterThan(30_000);
    expect(Buffer.byteLength(JSON.stringify(full))).toBeGreaterThan(10e6);
    expect(Buffer.byteLength(JSON.stringify(shown))).toBeLessThan(2e6);
    expect(shown.sampling!.solvedSteps).toBe(full.modes[0].steps.length);
  }, 60_000);

  it("allows fewer steps per branch as branches grow, so the branches' JSON stays near 1.6 MB", () => {
    expect(maxShownSteps(2)).toBe(2000);
    expect(maxShownSteps(4)).toBe(1250);
    expect(maxShownSteps(20)).toBe(100);
  });
});
