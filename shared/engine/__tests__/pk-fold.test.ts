/**
 * A fold of the p-k solution (docs/method-and-validation.md §4). Invented test data: a torsional stiffness A3* that
 * rises steeply between Ur 6.0 and 6.3 bends the torsional branch's fixed point back on itself, so the tracked branch
 * jumps from ζ ≈ +1.4 % to −2 % near 58.5 m/s without passing through zero. The flutter point reported must be the
 * neutral point of the harmonic determinant, located independently here twice: by a closed form (torsion alone,
 * derived from the equation of motion) and by the test's own determinant route (support/flutter-determinant.ts).
 */
import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { determinantFlutterPoint } from "./support/flutter-determinant";

const UR = [4, 6.0, 6.3, 9];
const A2 = [-0.1, -0.1, 0.3, 0.3];
const A3 = [0.2, 0.3, 1.2, 1.7];
const foldDeck: StudyDocument = {
  format: "stillspan.study/1",
  name: "p-k fold (test only)",
  air: { density: 1.225 },
  deck: { width: 25, depth: 3 },
  structure: {
    mass: 15000,
    inertia: 1400000,
    modes: [
      { id: "V1", dof: "heave", frequency: 0.15, damping: 0.005 },
      { id: "T1", dof: "torsion", frequency: 0.4, damping: 0.005 },
    ],
  },
  aerodynamics: { model: "tabulated", interpolation: "linear", reducedVelocity: UR, H1: [-2, -3, -3.15, -4.5], A2, A3 },
  sweep: { from: 10, to: 80, step: 1 },
};

/**
 * Torsion alone, harmonic motion: I(ω_α² − ω² + 2iζω_αω) = ½ρB⁴ω²(A3* + iA2*). With μ = ρB⁴/(2I): ω = ω_α/√(1 + μA3*)
 * and the neutral point where A2* / √(1 + μA3*) = 2ζ/μ; both derivatives are linear in Ur between the rows 6.0 and 6.3.
 */
function closedForm(): { speed: number; frequency: number } {
  const mu = (1.225 * 25 ** 4) / (2 * 1400000);
  const at = (values: number[], ur: number) => values[1] + ((values[2] - values[1]) * (ur - 6)) / 0.3;
  const g = (ur: number) => at(A2, ur) / Math.sqrt(1 + mu * at(A3, ur)) - (2 * 0.005) / mu;
  let lo = 6;
  let hi = 6.3;
  expect(Math.sign(g(lo))).not.toBe(Math.sign(g(hi)));
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (Math.sign(g(mid)) === Math.sign(g(lo))) lo = mid;
    else hi = mid;
  }
  const ur = 0.5 * (lo + hi);
  const frequency = 0.4 / Math.sqrt(1 + mu * at(A3, ur));
  return { speed: ur * frequency * 25, frequency };
}

describe("a p-k fold on the torsional branch", () => {
  const exact = closedForm();

  it("has the same neutral point by the closed form and by the independent determinant route", () => {
    const route = determinantFlutterPoint(foldDeck, createAeroModel(foldDeck.aerodynamics), [(2 * Math.PI) / 9, (2 * Math.PI) / 4]);
    expect(Math.abs(route!.speed - exact.speed), `${route!.speed} vs ${exact.speed}`).toBeLessThan(1e-6);
    expect(Math.abs(route!.frequency - exact.frequency)).toBeLessThan(1e-8);
  });

  it("really folds: the tracked torsional branch's damping jumps across zero between two close speeds", () => {
    const steps = runSweep(foldDeck, { step: 0.1 }).modes[1].steps.filter((s) => s.speed > 58 && s.speed < 59);
    const jump = steps.findIndex((s, k) => k > 0 && steps[k - 1].damping > 0.01 && s.damping < -0.01);
    expect(jump, steps.map((s) => `${s.speed.toFixed(3)}:${s.damping.toFixed(4)}`).join(" ")).toBeGreaterThan(0);
  });

  it.each([4, 2, 1, 0.5, 0.25])("reports the neutral point and its frequency, with a pk-fold warning, at step %s m/s", (step) => {
    const result = runSweep(foldDeck, { step });
    const flutter = result.flutter!;
    expect(Math.abs(flutter.speed - exact.speed), `step ${step}: ${flutter.speed} vs ${exact.speed}`).toBeLessThan(1e-3);
    expect(Math.abs(flutter.frequency - exact.frequency), `step ${step}: ${flutter.frequency} Hz`).toBeLessThan(1e-6);
    expect(flutter).toMatchObject({ mode: "T1", kind: "torsional" });
    const fold = result.warnings.find((w) => w.code === "pk-fold");
    expect(fold, JSON.stringify(result.warnings.map((w) => w.code))).toBeDefined();
    expect(fold!.speeds).toEqual([flutter.speed]);
    // the jump itself is located the same at every step (the last speed where the followed fixed point exists)
    expect(fold!.message).toContain("folds at 58.513 m/s: its damping ratio jumps from +1.37 % to −2.01 %");
    expect(fold!.message).toContain("det Z(U, ω) = 0");
  });

  it("says nothing of a fold where the damping passes through zero (benchmark deck, flat plate)", () => {
    const result = runSweep({ ...foldDeck, aerodynamics: { model: "flat-plate" }, sweep: { from: 1, to: 120, step: 1 } });
    expect(result.warnings.map((w) => w.code)).not.toContain("pk-fold");
  });
});
