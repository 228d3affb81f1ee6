import { describe, expect, it } from "vitest";
import { logDecrementFromDampingRatio } from "../check-input";
import { denHartogGalloping } from "../den-hartog-galloping";
import { divergenceSpeed } from "../../engine/divergence-speed";
import { gallopingFactorForRectangle } from "../galloping-factor-for-rectangle";
import { gallopingOnsetSpeed } from "../galloping-onset-speed";
import { scrutonNumber } from "../scruton-number";
import { strouhalForRectangle } from "../strouhal-for-rectangle";
import { torsionalScrutonNumber } from "../torsional-scruton-number";
import { vortexOnsetSpeed } from "../vortex-onset-speed";

function expectRelative(actual: number, expected: number, tol: number, what: string) {
  const error = Math.abs(actual - expected) / Math.abs(expected);
  expect(error, `${what}: got ${actual}, expected ${expected} (relative error ${error.toExponential(2)} > ${tol})`).toBeLessThanOrEqual(tol);
}

describe("vortex shedding (EN 1991-1-4:2005 Annex E.1.3.1 and E.1.3.3)", () => {
  it("v_crit = b n / St: b = 3 m, n = 0.35 Hz, St = 0.09 → 11.67 m/s (docs/conventions.md §Screening, computed)", () => {
    // By hand from Expr. (E.2): 3 × 0.35 / 0.09 = 11.666… m/s.
    expectRelative(vortexOnsetSpeed(3, 0.35, 0.09), (3 * 0.35) / 0.09, 1e-14, "v_crit by hand");
    expectRelative(vortexOnsetSpeed(3, 0.35, 0.09), 11.67, 5e-4, "v_crit domain check");
  });

  it("Sc = 2 δ m / (ρ b²): δ = 0.02, m = 12 000 kg/m, ρ = 1.25, b = 3 m → 42.67 (docs/conventions.md §Screening, computed)", () => {
    // By hand from Expr. (E.4): 2 × 0.02 × 12 000 / (1.25 × 9) = 480 / 11.25 = 42.666…
    expectRelative(scrutonNumber(0.02, 12000, 1.25, 3), 480 / 11.25, 1e-14, "Sc by hand");
    expectRelative(scrutonNumber(0.02, 12000, 1.25, 3), 42.67, 1e-4, "Sc domain check");
  });

  it("torsional Sc_θ = 2 δ I / (ρ B⁴) scales with I/B⁴ (common practice form)", () => {
    // By hand: 2 × 0.0251 × 1.45e6 / (1.225 × 27.5⁴).
    const byHand = (2 * 0.0251 * 1.45e6) / (1.225 * 27.5 ** 4);
    expectRelative(torsionalScrutonNumber(0.0251, 1.45e6, 1.225, 27.5), byHand, 1e-14, "Sc_θ by hand");
  });

  it("δ_s = 2πζ", () => {
    expectRelative(logDecrementFromDampingRatio(0.005), 2 * Math.PI * 0.005, 1e-15, "log decrement");
  });

  it("Strouhal table (from memory): end points reproduced, linear in between, nothing outside 1 ≤ d/b ≤ 10", () => {
    expect(strouhalForRectangle(1).value).toBeCloseTo(0.12, 12);
    expect(strouhalForRectangle(10).value).toBeCloseTo(0.09, 12);
    expect(strouhalForRectangle(7.5).value).toBeCloseTo(0.1, 12); // midway between (5, 0.11) and (10, 0.09)
    expect(strouhalForRectangle(12).value).toBeNull();
    expect(strouhalForRectangle(12).note).toMatch(/outside the table/);
    // The ratio is printed rounded to three significant figures, not with every digit of B/D.
    expect(strouhalForRectangle(37.4 / 3.5).note).toMatch(/^d\/b = 10\.7 lies outside the table/);
    expect(strouhalForRectangle(5).source).toMatch(/from memory/);
  });
});

describe("galloping (EN 1991-1-4:2005 Annex E.2.2; Den Hartog)", () => {
  it("v_CG = 2 Sc n b / a_G: Sc = 42.67, n = 0.35, b = 3, a_G = 2.0 → 44.8 m/s (docs/conventions.md §Screening, computed)", () => {
    // By hand from Expr. (E.18): 2 × 42.67 × 0.35 × 3 / 2 = 44.80 m/s.
    expectRelative(gallopingOnsetSpeed(42.67, 0.35, 3, 2), (2 * 42.67 * 0.35 * 3) / 2, 1e-14, "v_CG by hand");
    expectRelative(gallopingOnsetSpeed(42.67, 0.35, 3, 2), 44.8, 2e-4, "v_CG domain check");
  });

  it("Den Hartog onset equals the standard's formula with a_G = −(dC_L/dα + C_D) and b = B (closed-form identity)", () => {
    // Quasi-steady heave damping ζ_a = ρUB(C_L′ + C_D)/(4mω) (docs/conventions.md §Quasi-steady derivatives) makes the onset
    // U = 4mζω/(−ρB(C_L′+C_D)); with Sc = 2(2πζ)m/(ρB²) the standard's 2 Sc n B / a_G is the same number.
    const [liftSlope, drag, m, zeta, n, rho, B] = [-3.2, 0.9, 14000, 0.006, 0.4, 1.225, 20];
    const result = denHartogGalloping(liftSlope, drag, m, zeta, n, rho, B);
    const sc = scrutonNumber(2 * Math.PI * zeta, m, rho, B);
    expect(result.unstable).toBe(true);
    expect(result.coefficient).toBeCloseTo(-2.3, 12);
    expectRelative(result.onsetSpeedMps as number, gallopingOnsetSpeed(sc, n, B, -(liftSlope + drag)), 1e-12, "Den Hartog = E.18");
  });

  it("Den Hartog says no galloping when dC_L/dα + C_D ≥ 0 (flat-plate-like slope 2π)", () => {
    const result = denHartogGalloping(2 * Math.PI, 0.05, 14000, 0.006, 0.4, 1.225, 20);
    expect(result).toMatchObject({ unstable: false, onsetSpeedMps: null });
  });

  it("a_G table (from memory) gives 1.2 for the square and assumes no factor for deck-like d/b", () => {
    expect(gallopingFactorForRectangle(1)).toMatchObject({ value: 1.2, origin: "table" });
    expect(gallopingFactorForRectangle(0.5)).toMatchObject({ value: 0.7, origin: "table" });
    expect(gallopingFactorForRectangle(8)).toBeNull(); // a streamlined box, B/D ≈ 8: outside the rectangles
    expect(gallopingFactorForRectangle(0.2)).toBeNull();
  });
});

describe("torsional divergence (EN 1991-1-4:2005 Annex E.4.3, Expr. (E.24))", () => {
  it("matches [2 k_Θ/(ρ b² dc_M/dΘ)]^0.5 computed by hand within 0.1 %: benchmark deck inputs, flat plate", () => {
    // Inputs of the IABSE TG 3.1 benchmark deck (docs/conventions.md §Benchmark deck): B = 31 m, I = 2.47e6 kg·m²/m,
    // f_α = 0.278 Hz, ρ = 1.22 kg/m³; flat plate dC_M/dα = π/2. By hand:
    // ω_α = 2π·0.278 = 1.746726 rad/s; k_Θ = I ω_α² = 2.47e6 × 3.051050 = 7.536094e6 N·m/rad per m;
    // ρ b² S = 1.22 × 961 × 1.570796 = 1841.633; v_div = √(2 × 7.536094e6 / 1841.633) = √8184.07 = 90.466 m/s.
    const v = divergenceSpeed(2.47e6, 0.278, 1.22, 31, Math.PI / 2) as number;
    expectRelative(v, 90.466, 1e-3, "v_div against the hand computation");
    expectRelative(v, 90.47, 1e-3, "v_div against docs/conventions.md §Benchmark deck (computed, 90.47 m/s)");
  });

  it("returns null (no divergence) when the moment slope is not positive", () => {
    expect(divergenceSpeed(2.47e6, 0.278, 1.22, 31, -0.2)).toBeNull();
    expect(divergenceSpeed(2.47e6, 0.278, 1.22, 31, 0)).toBeNull();
  });

  it("gives none without air (ρ = 0: no aerodynamic moment)", () => {
    expect(divergenceSpeed(2.47e6, 0.278, 0, 31, 1)).toBeNull();
  });
});
