import { describe, expect, it } from "vitest";
import { runSweep } from "@shared/engine/run-sweep";
import { benchmarkDeck } from "@shared/engine/__tests__/support/benchmark-deck";
import { aeroFigure } from "@/features/studies/utils/aero-figure";
import { stepRows } from "@/features/studies/utils/step-rows";
import { dampingFigure, polePathFigure } from "@/features/studies/utils/result-figures";
import { assessRevision } from "@shared/assessment/assess-revision";
import { dampingAxisRange } from "@shared/figures/figure-data";

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
  it("draw the shared figure data: the flutter point on the imaginary axis, the zero-damping line, the flutter speed", () => {
    expect(result.flutter).not.toBeNull();
    const assessment = assessRevision({ document: study, result, criteria: null });
    const poles = polePathFigure([{ name: "r1", result, assessment }]);
    const marker = poles.data.find((t) => t.name === "Flutter point")!;
    expect(marker.x).toEqual([0]);
    expect((marker.y as number[])[0]).toBeCloseTo(2 * Math.PI * result.flutter!.frequency, 12);
    const damping = dampingFigure([{ name: "r1", result, assessment }]);
    const shapes = damping.layout.shapes as Array<Record<string, unknown>>;
    expect(shapes.some((s) => s.yref === "y" && s.y0 === 0 && s.y1 === 0)).toBe(true);
    expect(shapes.some((s) => s.x0 === result.flutter!.speed && s.x1 === result.flutter!.speed)).toBe(true);
    expect((damping.layout.yaxis as { range: [number, number] }).range).toEqual(dampingAxisRange(result.modes.flatMap((m) => m.steps)));
  });

  it("colour the flutter speed by its verdict, not by being a flutter speed", () => {
    const passing = assessRevision({ document: study, result, criteria: null });
    const line = (a: typeof passing) =>
      (dampingFigure([{ name: "r1", result, assessment: a }]).layout.shapes as Array<{ x0: number; line: { color: string } }>).find(
        (s) => s.x0 === result.flutter!.speed,
      )!.line.color;
    const failing = structuredClone(passing);
    failing.margins = { flutter: { status: "fail" } } as typeof failing.margins;
    expect(line(failing)).not.toBe(line(passing));
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
