import { describe, expect, it } from "vitest";
import { createFlatPlateModel } from "../flat-plate";
import { createQuasiSteadyModel } from "../quasi-steady";

describe("quasi-steady model", () => {
  it("with C_L′ = 2π, C_D = 0, C_M′ = π/2 equals the flat plate's steady limits (docs/conventions.md §Quasi-steady derivatives)", () => {
    const quasi = createQuasiSteadyModel({ liftSlope: 2 * Math.PI, dragCoefficient: 0, momentSlope: Math.PI / 2 });
    const plate = createFlatPlateModel().products(0);
    for (const K of [0.01, 0.5, 3]) {
      const p = quasi.products(K);
      expect(p.kH1).toBeCloseTo(plate.kH1, 14);
      expect(p.k2H3).toBeCloseTo(plate.k2H3, 14);
      expect(p.kA1).toBeCloseTo(plate.kA1, 14);
      expect(p.k2A3).toBeCloseTo(plate.k2A3, 14);
      expect([p.kH2, p.k2H4, p.kA2, p.k2A4]).toEqual([0, 0, 0, 0]);
    }
    expect(quasi.staticMomentSlope).toBe(Math.PI / 2);
  });

  it("gives H1* = −(C_L′ + C_D)/K, H3* = −C_L′/K², A1* = C_M′/K, A3* = C_M′/K² (Simiu & Scanlan; docs/conventions.md §Quasi-steady derivatives)", () => {
    const model = createQuasiSteadyModel({ liftSlope: 4.1, dragCoefficient: 0.12, momentSlope: 1.3 });
    const K = 0.8;
    const d = model.derivatives(K);
    expect(d.H1).toBeCloseTo(-(4.1 + 0.12) / K, 12);
    expect(d.H3).toBeCloseTo(-4.1 / (K * K), 12);
    expect(d.A1).toBeCloseTo(1.3 / K, 12);
    expect(d.A3).toBeCloseTo(1.3 / (K * K), 12);
  });

  // Den Hartog's galloping criterion: a section gallops (negative aerodynamic heave damping) exactly when
  // dC_L/dα + C_D < 0 (J. P. Den Hartog, Mechanical Vibrations, 4th ed., 1956, §7.7 — section from memory).
  // Heave equation m ḧ + (2mζω − ½ρUB·K·H1*) ḣ + … = 0: the aerodynamic part of the damping is −½ρUB·K·H1*.
  it("has negative heave aerodynamic damping exactly when C_L′ + C_D < 0 (Den Hartog)", () => {
    const rho = 1.25;
    const U = 25;
    const B = 12;
    for (const liftSlope of [-6, -2.5, -0.4, 0, 0.3, 2, 5.5]) {
      for (const dragCoefficient of [0, 0.35, 1.1, 2.4]) {
        const model = createQuasiSteadyModel({ liftSlope, dragCoefficient, momentSlope: 0.7 });
        const aeroDamping = -0.5 * rho * U * B * model.products(0.3).kH1;
        const sum = liftSlope + dragCoefficient;
        if (sum === 0) continue;
        expect(aeroDamping < 0, `C_L′ = ${liftSlope}, C_D = ${dragCoefficient}`).toBe(sum < 0);
      }
    }
  });

  it("rejects non-finite coefficients with the coefficient's name", () => {
    expect(() => createQuasiSteadyModel({ liftSlope: Number.NaN, dragCoefficient: 0, momentSlope: 1 })).toThrow(
      /liftSlope/,
    );
  });
});
