import { describe, expect, it } from "vitest";
import { WARNING_CODES } from "@shared/schemas/result";
import { derivedQuantities } from "@shared/study-derived-quantities";
import { explainWarningCode, WARNING_TITLES } from "@shared/warning-text";

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
    expect(q.inertiaRatio).toBeCloseTo(2.47e6 / (1.22 * 31 ** 4), 10);
  });

  it("leaves a quantity empty while one of its inputs is missing or not a positive number", () => {
    const q = derivedQuantities({ air: { density: 0 }, deck: { width: 31 }, structure: { mass: Number.NaN, inertia: 2e6, modes: [{ dof: "heave", frequency: 0.1 }] } });
    expect(q).toEqual({ frequencyRatio: null, radiusOfGyrationM: null, radiusOverWidth: null, massRatio: null, inertiaRatio: null });
  });
});

describe("warning text", () => {
  it("explains every warning code the engine can emit in one or two sentences with a title", () => {
    for (const code of WARNING_CODES) {
      expect(explainWarningCode(code)).toMatch(/^[A-Z].*\.$/);
      expect(explainWarningCode(code)!.split(". ").length).toBeLessThanOrEqual(2);
      expect(WARNING_TITLES[code]).toBeTruthy();
    }
  });
});
