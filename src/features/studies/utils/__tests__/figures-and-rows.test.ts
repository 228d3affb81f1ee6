import { describe, expect, it } from "vitest";
import { runSweep } from "@shared/engine/run-sweep";
import type { StudyDocument } from "@shared/schemas/study";
import { aeroFigure } from "@/features/studies/utils/aero-figure";
import { stepRows } from "@/features/studies/utils/step-rows";
import { dampingFigure, polePathFigure } from "@/features/studies/utils/result-figures";

/** The IABSE TG 3.1 benchmark deck's inputs (domain guide §5) on a short coarse sweep; only the plot and table plumbing is checked. */
const study: StudyDocument = {
  format: "stillspan.study/1",
  name: "benchmark deck, thin plate",
  air: { density: 1.22 },
  deck: { width: 31, depth: 3 },
  structure: {
    mass: 22_740,
    inertia: 2.47e6,
    modes: [
      { id: "h", dof: "heave", frequency: 0.1, damping: 0.003 },
      { id: "a", dof: "torsion", frequency: 0.278, damping: 0.003 },
    ],
  },
  aerodynamics: { model: "flat-plate" },
  sweep: { from: 60, to: 90, step: 2 },
};
const result = runSweep(study);

describe("step rows of the steps table", () => {
  it("has one row per step of every branch the result carries, ordered by speed, then by branch", () => {
    const rows = stepRows(result);
    const total = result.modes.reduce((n, m) => n + m.steps.length, 0);
    expect(rows).toHaveLength(total);
    const speeds = rows.map((r) => r.speed);
    expect(speeds).toEqual([...speeds].sort((x, y) => x - y));
    expect(rows.slice(0, 2).map((r) => r.mode)).toEqual(["a", "h"]);
    expect(rows[0]).toMatchObject({ ...result.modes[1].steps[0], mode: "a" });
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
