import { describe, expect, it } from "vitest";
import { assessRevision } from "../../assessment/assess-revision";
import { runSweep } from "../../engine/run-sweep";
import { inventedDeckB } from "../../engine/__tests__/support/invented-deck-b";
import { dampingAxisRange, dampingFigureData, frequencyFigureData, polePathFigureData } from "../figure-data";

const document = inventedDeckB();
const result = runSweep(document);
const assessment = assessRevision({ document, result, criteria: null });
const run = { name: "r3", branches: result.modes, assessment };

describe("shared figure data (drawn by plotly and by the PDF)", () => {
  it("marks the assessment's flutter speed and both divergence figures, each named by its basis", () => {
    const figure = dampingFigureData([run]);
    const byKind = Object.fromEntries(figure.markers.map((m) => [m.kind, m]));
    expect(byKind.flutter.x).toBe(result.flutter!.speed);
    expect(byKind.flutter.label).toBe(`flutter ${result.flutter!.speed.toFixed(2)} m/s`);
    expect(byKind["divergence-closed-form"].x).toBe(result.divergence!.speed);
    expect(byKind["divergence-closed-form"].label).toMatch(/^closed-form divergence /);
    const statics = result.warnings.find((w) => w.code === "static-instability")!;
    expect(byKind["static-instability"]).toMatchObject({ x: statics.speeds![0], label: expect.stringMatching(/^static instability .*, VS1$/) });
    // Without criteria there is no required speed to mark.
    expect(byKind["required-flutter"]).toBeUndefined();
    expect(frequencyFigureData([run]).markers).toEqual(figure.markers);
  });

  it("breaks the damping curve where a branch becomes a real pole, and frames the axis around zero", () => {
    const figure = dampingFigureData([run]);
    const heave = figure.series.find((s) => s.name === "Branch VS1")!;
    const steps = result.modes.find((m) => m.id === "VS1")!.steps;
    steps.forEach((s, k) => expect(heave.points[k][1]).toBe(s.frequency === 0 ? null : s.damping * 100));
    expect(heave.points.some((p) => p[1] === null)).toBe(true);
    expect(figure.zeroLine).toBe(true);
    expect(figure.yRange).toEqual(dampingAxisRange(result.modes.flatMap((m) => m.steps)));
    expect(figure.yRange![0]).toBeLessThan(0);
    expect(figure.yRange![1]).toBeLessThan(15);
  });

  it("puts the flutter point of the pole paths on the imaginary axis at 2π f_F", () => {
    const poles = polePathFigureData([run]);
    expect(poles.flutterPoints).toHaveLength(1);
    expect(poles.flutterPoints[0].re).toBe(0);
    expect(poles.flutterPoints[0].im).toBeCloseTo(2 * Math.PI * result.flutter!.frequency, 12);
  });

  it("names overlaid runs' series and markers by run", () => {
    const figure = dampingFigureData([run, { ...run, name: "r2" }]);
    expect(figure.series.map((s) => s.name)).toEqual(["r3 · VS1", "r3 · TS1", "r2 · VS1", "r2 · TS1"]);
    expect(figure.markers.filter((m) => m.kind === "flutter").map((m) => m.label)).toEqual([
      expect.stringMatching(/\(r3\)$/),
      expect.stringMatching(/\(r2\)$/),
    ]);
  });
});
