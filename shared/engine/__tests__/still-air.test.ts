import { describe, expect, it } from "vitest";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { benchmarkDeck } from "./support/benchmark-deck";

describe("poles at U = 0", () => {
  it("tabulated data: the structural poles −ζω ± iω√(1−ζ²) (the forces vanish as U → 0)", () => {
    const ur = [2, 6, 12];
    const study: StudyDocument = {
      ...benchmarkDeck({ from: 0, to: 10, step: 5 }),
      aerodynamics: { model: "tabulated", interpolation: "linear", reducedVelocity: ur, H1: [-1, -4, -9], A2: [-0.1, -0.5, -1], A3: [0.1, 0.5, 2] },
    };
    const result = runSweep(study);
    result.modes.forEach((mode, j) => {
      const input = study.structure.modes[j];
      const w = 2 * Math.PI * input.frequency;
      const s = mode.steps[0];
      expect(s.speed).toBe(0);
      expect(Math.abs(s.re + input.damping * w)).toBeLessThan(1e-6 * w);
      expect(Math.abs(s.im - w * Math.sqrt(1 - input.damping ** 2))).toBeLessThan(1e-6 * w);
    });
  });

  it("thin plate: frequencies lowered by the apparent mass πρb² and inertia πρb⁴/8 (b = B/2)", () => {
    // Theodorsen 1935, NACA Report 496, non-circulatory terms; as in Bisplinghoff, Ashley & Halfman 1955
    const result = runSweep(benchmarkDeck({ from: 0, to: 10, step: 5, damping: 0 }));
    const b = 31 / 2;
    const addedMass = Math.PI * 1.22 * b * b;
    const addedInertia = (Math.PI * 1.22 * b ** 4) / 8;
    const heave = 0.1 * Math.sqrt(22740 / (22740 + addedMass));
    const torsion = 0.278 * Math.sqrt(2.47e6 / (2.47e6 + addedInertia));
    expect(result.modes[0].steps[0].frequency).toBeCloseTo(heave, 9);
    expect(result.modes[1].steps[0].frequency).toBeCloseTo(torsion, 9);
  });
});
