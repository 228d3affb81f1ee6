import { describe, expect, it } from "vitest";
import { WARNING_CODES } from "@shared/schemas/result";
import { derivedQuantities } from "@/features/studies/utils/derived-quantities";
import { explainWarning, warningSpeeds, WARNING_TITLES } from "@/features/studies/utils/warning-text";

describe("derivedQuantities", () => {
  it("gives f_α/f_h, √(I/m) and m/(ρB²) for the IABSE TG 3.1 benchmark inputs (docs/conventions.md §Benchmark deck)", () => {
    const q = derivedQuantities({
      air: { density: 1.22 },
      deck: { width: 31 },
      structure: { mass: 22_740, inertia: 2.47e6, modes: [{ dof: "heave", frequency: 0.1 }, { dof: "torsion", frequency: 0.278 }] },
    });
    expect(q.frequencyRatio).toBeCloseTo(2.78, 10);
    expect(q.radiusOfGyrationM).toBeCloseTo(Math.sqrt(2.47e6 / 22_740), 10);
    expect(q.radiusOverWidth).toBeCloseTo(Math.sqrt(2.47e6 / 22_740) / 31, 10);
    expect(q.massRatio).toBeCloseTo(22_740 / (1.22 * 31 * 31), 10);
  });

  it("leaves a quantity empty while one of its inputs is missing or not a positive number", () => {
    const q = derivedQuantities({ air: { density: 0 }, deck: { width: 31 }, structure: { mass: Number.NaN, inertia: 2e6, modes: [{ dof: "heave", frequency: 0.1 }] } });
    expect(q).toEqual({ frequencyRatio: null, radiusOfGyrationM: null, radiusOverWidth: null, massRatio: null });
  });
});

describe("warning text", () => {
  it("explains every warning code the engine can emit in one sentence with a title", () => {
    for (const code of WARNING_CODES) {
      expect(explainWarning(code)).toMatch(/^[A-Z].*\.$/);
      expect(explainWarning(code).split(". ").length).toBeLessThanOrEqual(2);
      expect(WARNING_TITLES[code]).toBeTruthy();
    }
  });

  it("states the speeds a warning concerns: a range for extrapolation, a list otherwise", () => {
    expect(warningSpeeds({ code: "extrapolated-derivatives", message: "", speeds: [41.5, 120] })).toBe("41.5–120.0 m/s");
    expect(warningSpeeds({ code: "unstable-at-start", message: "", speeds: [1] })).toBe("at 1.0 m/s");
    expect(warningSpeeds({ code: "tracking-ambiguous", message: "", speeds: [10, 10.5, 11] })).toBe("at 3 speeds: 10.0, 10.5, 11.0 m/s");
    expect(warningSpeeds({ code: "no-convergence", message: "" })).toBeNull();
  });
});
