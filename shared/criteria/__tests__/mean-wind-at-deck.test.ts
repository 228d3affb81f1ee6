import { describe, expect, it } from "vitest";
import { meanWindAtDeck } from "../mean-wind-at-deck";
import { probabilityFactor } from "../probability-factor";
import { roughnessFactor } from "../roughness-factor";
import { terrainFactor } from "../terrain-factor";

/** |actual − expected| ≤ tol·|expected|, with both numbers in the failure message. */
function expectRelative(actual: number, expected: number, tol: number, what: string) {
  const error = Math.abs(actual - expected) / Math.abs(expected);
  expect(error, `${what}: got ${actual}, expected ${expected} (relative error ${error.toExponential(2)} > ${tol})`).toBeLessThanOrEqual(tol);
}

describe("terrain and roughness factors (EN 1991-1-4:2005 §4.3.2, Expr. 4.4–4.5)", () => {
  it("category II at 60 m gives c_r = 1.3471 (docs/conventions.md §Wind at deck level, computed) and equals k_r ln(z/z0) by hand", () => {
    // Hand computation from Expr. (4.4)–(4.5): k_r = 0.19 (0.05/0.05)^0.07 = 0.19; c_r = 0.19 ln(60/0.05).
    const byHand = 0.19 * Math.log(60 / 0.05);
    const result = roughnessFactor(60, 0.05, 2);
    expectRelative(result.terrainFactor, 0.19, 1e-12, "k_r category II");
    expectRelative(result.roughnessFactor, byHand, 1e-12, "c_r by hand");
    expectRelative(result.roughnessFactor, 1.3471, 5e-5, "c_r domain check (computed)");
  });

  it("category 0 gives k_r = 0.1560 (docs/conventions.md §Wind at deck level, computed; by hand 0.19·(0.003/0.05)^0.07)", () => {
    const byHand = 0.19 * Math.pow(0.003 / 0.05, 0.07);
    expectRelative(terrainFactor(0.003), byHand, 1e-12, "k_r by hand");
    expectRelative(terrainFactor(0.003), 0.156, 5e-4, "k_r domain check (computed)");
  });

  it("reproduces the published worked example: category III, z = 8 m → k_r = 0.215, c_r = 0.706", () => {
    // Source: Steel Buildings in Europe, Single-Storey Steel Buildings, Part 3: Actions (ArcelorMittal /
    // CTICM / SCI), Appendix B "Worked Example: Wind action on a single-storey building", steps 4–5:
    // z0 = 0.3 m, z_min = 5 m, k_r = 0.215, c_r(8 m) = 0.706. The example rounds k_r to 0.215 before the
    // product (0.215 ln(8/0.3) = 0.7059); unrounded k_r = 0.21539 gives 0.7072, so the tolerance is 0.2 %.
    const result = roughnessFactor(8, 0.3, 5);
    expect(result.terrainFactor.toFixed(3)).toBe("0.215");
    expectRelative(result.roughnessFactor, 0.706, 2e-3, "c_r(8 m), category III");
  });

  it("holds c_r at z_min below the minimum height (category IV, z = 6 m < 10 m)", () => {
    const held = roughnessFactor(6, 1.0, 10);
    expect(held.heldAtMinimum).toBe(true);
    expect(held.roughnessFactor).toBe(roughnessFactor(10, 1.0, 10).roughnessFactor);
  });

  it("rejects heights above z_max = 200 m and non-positive roughness with a message naming the input", () => {
    expect(() => roughnessFactor(250, 0.05, 2)).toThrow(/z_max = 200 m/);
    expect(() => terrainFactor(0)).toThrow(/roughness length z0/);
  });
});

describe("probability factor (EN 1991-1-4:2005 §4.2(2) Note 4, Expr. 4.2, K = 0.2, n = 0.5)", () => {
  const byHand = (years: number) => {
    const p = 1 / years;
    return Math.sqrt((1 - 0.2 * Math.log(-Math.log(1 - p))) / (1 - 0.2 * Math.log(-Math.log(0.98))));
  };

  it.each([
    [100, 1.0385],
    [1000, 1.1565],
    [10000, 1.2635],
  ])("return period %i years gives c_prob = %f (docs/conventions.md §Wind at deck level, computed) and matches Expr. (4.2) by hand", (years, expected) => {
    const value = probabilityFactor(1 / years);
    expectRelative(value, byHand(years), 1e-12, `c_prob(${years} yr) by hand`);
    expectRelative(value, expected, 5e-5, `c_prob(${years} yr) domain check`);
  });

  it("gives exactly 1 for the 50-year wind (p = 0.02), the reference of the expression", () => {
    expectRelative(probabilityFactor(0.02), 1, 1e-14, "c_prob(50 yr)");
  });

  it("rejects p outside (0, 1)", () => {
    expect(() => probabilityFactor(1)).toThrow(/between 0 and 1/);
  });
});

describe("mean wind at deck level (EN 1991-1-4:2005 §4.3.1, Expr. 4.3)", () => {
  it("category II, z = 60 m, v_b = 26 m/s → v_m = 35.02 m/s (docs/conventions.md §Wind at deck level, computed) with every factor", () => {
    const result = meanWindAtDeck({
      basicSpeed: 26,
      probability: { kind: "return-period", years: 50 },
      terrain: { kind: "category", category: "II" },
      deckHeight: 60,
    });
    expectRelative(result.meanSpeedMps, 0.19 * Math.log(60 / 0.05) * 26, 1e-12, "v_m by hand");
    expectRelative(result.meanSpeedMps, 35.02, 2e-4, "v_m domain check");
    expect(result.probabilityFactor).toBeCloseTo(1, 12);
    expect(result.orographyFactor).toBe(1);
    expect(result).toMatchObject({ terrainCategory: "II", roughnessLengthM: 0.05, minimumHeightM: 2, heightUsedM: 60 });
    expect(result.sources.join(" ")).toMatch(/Expr\. \(4\.4\)/);
  });

  it("category 0 → v_m = 40.18 m/s (docs/conventions.md §Wind at deck level, computed; by hand k_r ln(60/0.003) · 26)", () => {
    const result = meanWindAtDeck({
      basicSpeed: 26,
      probability: { kind: "annual-probability", value: 0.02 },
      terrain: { kind: "category", category: "0" },
      deckHeight: 60,
    });
    const byHand = 0.19 * Math.pow(0.003 / 0.05, 0.07) * Math.log(60 / 0.003) * 26;
    expectRelative(result.meanSpeedMps, byHand, 1e-12, "v_m by hand");
    expectRelative(result.meanSpeedMps, 40.18, 3e-4, "v_m domain check");
  });

  it("multiplies c_o and a given c_prob, and says so in the notes", () => {
    const result = meanWindAtDeck({
      basicSpeed: 26,
      probability: { kind: "factor", value: 1.1, basis: "owner's specification" },
      terrain: { kind: "roughness", roughnessLength: 0.05, minimumHeight: 2 },
      deckHeight: 60,
      orographyFactor: 1.05,
    });
    expectRelative(result.meanSpeedMps, 0.19 * Math.log(1200) * 1.05 * 1.1 * 26, 1e-12, "v_m with c_o and c_prob");
    expect(result.annualProbability).toBeNull();
    expect(result.notes.join(" ")).toMatch(/owner's specification/);
    expect(result.notes.join(" ")).toMatch(/c_o = 1.05/);
  });
});
