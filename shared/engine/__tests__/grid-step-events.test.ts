/**
 * No reported event may depend on the grid step (docs/method-and-validation.md §3, "what a grid must not hide").
 * The two studies below are invented test data; the expected values are closed forms derived here from the
 * equations of motion (docs/method-and-validation.md §1) and, for the narrow window, the independent flutter
 * determinant of the test support (support/flutter-determinant.ts).
 */
import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { determinantFlutterPoint } from "./support/flutter-determinant";

/** A narrow A2* bump between Ur 5.8 and 6.4, no coupling terms (invented test data). */
const narrowWindow: StudyDocument = {
  format: "stillspan.study/1",
  name: "narrow A2* window",
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
  aerodynamics: {
    model: "tabulated",
    interpolation: "linear",
    reducedVelocity: [5.8, 6.0, 6.2, 6.4],
    H1: [-3, -3, -3, -3],
    A2: [-0.1, 0.6, 0.6, -0.1],
  },
  sweep: { from: 4, to: 82, step: 6 },
};

/** Quasi-steady deck whose torsional pair reaches the real axis and crosses zero within one step (invented). */
const staticInsideStep: StudyDocument = {
  format: "stillspan.study/1",
  name: "static crossing inside one step",
  air: { density: 1.225 },
  deck: { width: 14.05, depth: 2.11 },
  structure: {
    mass: 7534,
    inertia: 137900,
    modes: [
      { id: "V1", dof: "heave", frequency: 0.5008, damping: 0.00975 },
      { id: "T1", dof: "torsion", frequency: 0.5258, damping: 0.00142 },
    ],
  },
  aerodynamics: { model: "quasi-steady", liftSlope: 3.46, dragCoefficient: 0.136, momentSlope: 1.5 },
  sweep: { from: 4.75, to: 111.1, step: 0.5 },
};

describe("a narrow instability window between grid points (A2* bump, Ur 5.8–6.4)", () => {
  // Torsion alone (no H2*, H3*, A1*, A4*, A3*): for harmonic motion I(−ω² + 2iζω_αω + ω_α²) = ½ρB⁴ω² iA2*, so the
  // frequency stays ω_α and the branch is undamped where A2* = 4Iζ/(ρB⁴) (domain check of §4 of the method, derived
  // from the equation of motion); A2* rises linearly from −0.1 to 0.6 on Ur 5.8–6.0, and U = f_α B Ur.
  const { inertia } = narrowWindow.structure;
  const threshold = (4 * inertia * 0.005) / (1.225 * 25 ** 4);
  const closedForm = 0.4 * 25 * (5.8 + (0.2 * (threshold + 0.1)) / 0.7);

  it("checks the closed form against the independent flutter determinant", () => {
    const aero = createAeroModel(narrowWindow.aerodynamics);
    const point = determinantFlutterPoint(narrowWindow, aero, [(2 * Math.PI) / 6.4, (2 * Math.PI) / 5.8]);
    expect(Math.abs(point!.speed - closedForm), `determinant ${point!.speed} vs closed form ${closedForm}`).toBeLessThan(1e-6);
    expect(closedForm).toBeCloseTo(58.453, 3);
  });

  it.each([6, 3, 0.5])("finds the window at step %s m/s: flutter at the closed form, torsional, on T1", (step) => {
    const result = runSweep(narrowWindow, { step });
    expect(result.flutter, `step ${step}: ${JSON.stringify(result.warnings)}`).not.toBeNull();
    expect(Math.abs(result.flutter!.speed - closedForm), `step ${step}: ${result.flutter!.speed} vs ${closedForm}`).toBeLessThan(1e-3);
    expect(result.flutter).toMatchObject({ mode: "T1", kind: "torsional" });
    expect(result.flutter!.frequency).toBeCloseTo(0.4, 6);
  });

  it("visits the speed at which the torsional branch passes each table row, whatever the step", () => {
    const t1 = runSweep(narrowWindow, { step: 6 }).modes[1].steps;
    for (const knot of [5.8, 6.0, 6.2, 6.4]) {
      const nearest = Math.min(...t1.map((s) => Math.abs(s.speed / (s.frequency * 25) / knot - 1)));
      expect(nearest, `row Ur = ${knot}`).toBeLessThan(1e-5);
    }
  });
});

describe("a static crossing inside one step (quasi-steady deck)", () => {
  // Quasi-steady data have K²H4* = K²A4* = 0, so det(K_s − K_ae) = mω_h²(Iω_α² − ½ρU²B²C_M′): the real root crosses
  // zero exactly at U = √(2Iω_α²/(ρB²C_M′)), the closed form of EN 1991-1-4:2005 E.4.3, Expr. (E.24), k_Θ = Iω_α².
  const omega = 2 * Math.PI * 0.5258;
  const closedForm = Math.sqrt((2 * 137900 * omega * omega) / (1.225 * 14.05 * 14.05 * 1.5));

  it("computes the closed-form divergence 91.098 m/s", () => {
    expect(closedForm).toBeCloseTo(91.098, 3);
  });

  it.each([2, 0.5, 0.13])("reports the static crossing at the closed form at step %s m/s", (step) => {
    const result = runSweep(staticInsideStep, { step });
    const statics = result.warnings.filter((w) => w.code === "static-instability");
    expect(statics, `step ${step}: ${JSON.stringify(result.warnings.map((w) => w.code))}`).toHaveLength(1);
    expect(statics[0].speeds).toHaveLength(1);
    expect(Math.abs(statics[0].speeds![0] - closedForm), `step ${step}: ${statics[0].speeds}`).toBeLessThan(1e-6);
    expect(result.divergence!.speed).toBeCloseTo(closedForm, 9);
  });
});
