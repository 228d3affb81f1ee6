import { describe, expect, it } from "vitest";
import { besselJY01 } from "../bessel-jy01";
import reference from "./fixtures/aero-reference.json";

/** Absolute error where |f| < 1, relative above (Y0, Y1 grow without bound as x → 0). */
const scaledError = (got: number, want: number) => Math.abs(got - want) / Math.max(1, Math.abs(want));

describe("besselJY01", () => {
  // Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 9.1, rounded to 10 decimals
  // (values from memory; they agree with mpmath to every digit shown).
  it.each([
    [1, 0.7651976866, 0.4400505857, 0.0882569642, -0.7812128213],
    [2, 0.2238907791, 0.5767248078, 0.5103756726, -0.1070324315],
    [5, -0.1775967713, -0.3275791376, -0.3085176252, 0.1478631434],
    [10, -0.2459357645, 0.0434727462, 0.0556711673, 0.2490154242],
  ])("matches A&S Table 9.1 at x = %d to 1e-9", (x, j0, j1, y0, y1) => {
    const [J0, J1, Y0, Y1] = besselJY01(x);
    for (const [got, want, name] of [[J0, j0, "J0"], [J1, j1, "J1"], [Y0, y0, "Y0"], [Y1, y1, "Y1"]] as const) {
      expect(Math.abs(got - want), `${name}(${x}) = ${got}, table ${want}, tolerance 1e-9`).toBeLessThan(1e-9);
    }
  });

  it("agrees with mpmath (40 digits) to 3e-12 from x = 1e-8 to 1e7, across the series/asymptotic switch at 12", () => {
    const out = new Float64Array(4);
    for (const row of reference.bessel) {
      besselJY01(row.x, out);
      const errors = [row.J0, row.J1, row.Y0, row.Y1].map((want, i) => scaledError(out[i], want));
      expect(Math.max(...errors), `x = ${row.x}: errors ${errors.map((e) => e.toExponential(1))}`).toBeLessThan(3e-12);
    }
  });

  it("satisfies the Wronskian J1·Y0 − J0·Y1 = 2/(πx) (A&S 9.1.16) on a dense grid", () => {
    const out = new Float64Array(4);
    for (let x = 0.01; x < 60; x *= 1.07) {
      const [j0, j1, y0, y1] = besselJY01(x, out);
      const wronskian = j1 * y0 - j0 * y1;
      expect(Math.abs(wronskian * ((Math.PI * x) / 2) - 1), `x = ${x}`).toBeLessThan(1e-11);
    }
  });

  it("rejects x ≤ 0, NaN and Infinity with a plain message", () => {
    for (const x of [0, -1, Number.NaN, Infinity]) expect(() => besselJY01(x)).toThrow(/finite x > 0/);
  });
});
