import { describe, expect, it } from "vitest";
import { runSweep } from "@shared/engine/run-sweep";
import { benchmarkDeck } from "@shared/engine/__tests__/support/benchmark-deck";
import { aeroFigure } from "@/features/studies/utils/aero-figure";
import { stepRows } from "@/features/studies/utils/step-rows";
import { dampingFigure, polePathFigure } from "@/features/studies/utils/result-figures";
import { dampingAxisRange } from "@/lib/damping-frame";

/** The IABSE TG 3.1 benchmark deck on a short coarse sweep (the engine tests' one definition); only the plot and table plumbing is checked. */
const study = benchmarkDeck({ from: 60, to: 90, step: 2 });
const result = runSweep(study);

describe("step rows of the steps table", () => {
  it("has one row per step of every branch the result carries, ordered by speed, then by branch", () => {
    const rows = stepRows(result);
    const total = result.modes.reduce((n, m) => n + m.steps.length, 0);
    expect(rows).toHaveLength(total);
    const speeds = rows.map((r) => r.speed);
    expect(speeds).toEqual([...speeds].sort((x, y) => x - y));
    expect(rows.slice(0, 2).map((r) => r.mode)).toEqual(["T1", "V1"]);
    expect(rows[0]).toMatchObject({ ...result.modes[1].steps[0], mode: "T1" });
  });
});

describe("result figures", () => {
  it("mark the flutter point on the imaginary axis at 2π f_F, and the zero-damping line", () => {
    expect(result.flutter).not.toBeNull();
    const poles = polePathFigure([{ name: "r1", result }]);
    const marker = poles.data.find((t) => t.name === "Flutter point")!;
    expect(marker.x).toEqual([0]);
    expect((marker.y as number[])[0]).toBeCloseTo(2 * Math.PI * result.flutter!.frequency, 12);
    const damping = dampingFigure([{ name: "r1", result }]);
    const shapes = damping.layout.shapes as Array<Record<string, unknown>>;
    expect(shapes.some((s) => s.yref === "y" && s.y0 === 0 && s.y1 === 0)).toBe(true);
    expect(shapes.some((s) => s.x0 === result.flutter!.speed && s.x1 === result.flutter!.speed)).toBe(true);
  });
});

describe("damping plot of a branch that turns into a real pole", () => {
  it("leaves a gap where the pole does not oscillate instead of a wall from +100 % to -100 %", () => {
    const step = (speed: number, frequency: number, damping: number) =>
      ({ speed, frequency, damping, re: 0, im: 0, participation: { h: 1 }, mac: 1, confidence: 1 });
    const real = {
      ...result,
      modes: [{ ...result.modes[0], steps: [step(10, 0.1, 0.02), step(20, 0, 1), step(30, 0, -1), step(40, 0.1, 0.03)] }],
    } as typeof result;
    const figure = dampingFigure([{ name: "r1", result: real }]);
    expect((figure.data[0] as { y: Array<number | null> }).y).toEqual([2, null, null, 3]);
    const range = (figure.layout.yaxis as { range: [number, number] }).range;
    expect(range[1]).toBeLessThan(50);
    expect(range).toEqual(dampingAxisRange(real.modes[0].steps)); // the framing shared with the signed summary
  });
});

describe("derivative plots", () => {
  it("shade the tested range of a table and draw its points in every panel", () => {
    const table = { model: "tabulated" as const, interpolation: "linear" as const, reducedVelocity: [2, 6, 10], H1: [-0.6, -3.3, -5.8], A2: [-0.03, -0.33, -0.79] };
    const figure = aeroFigure(table);
    const rects = (figure.layout.shapes as Array<Record<string, unknown>>).filter((s) => s.type === "rect");
    expect(rects).toHaveLength(8);
    expect(rects.every((r) => r.x0 === 2 && r.x1 === 10)).toBe(true);
    const points = figure.data.filter((t) => t.mode === "markers");
    expect(points).toHaveLength(8);
    expect(points[0].y).toEqual([-0.6, -3.3, -5.8]);
    expect(points[1].y).toEqual([0, 0, 0]);
  });
});
