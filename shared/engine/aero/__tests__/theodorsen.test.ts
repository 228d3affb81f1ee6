import { describe, expect, it } from "vitest";
import { theodorsen } from "../theodorsen";
import reference from "./fixtures/aero-reference.json";

describe("theodorsen", () => {
  // Published tables: Theodorsen, NACA Report 496 (1935); Bisplinghoff, Ashley & Halfman, Aeroelasticity (1955);
  // 4 decimals, as reproduced in docs/conventions.md §Flat plate → tolerance 1e-4.
  it.each([
    [0.1, 0.8319, -0.1723],
    [0.2, 0.7276, -0.1886],
    [0.3, 0.665, -0.1793],
    [0.5, 0.5979, -0.1507],
    [1.0, 0.5394, -0.1003],
  ])("matches the published table at k = %d", (k, F, G) => {
    const [f, g] = theodorsen(k);
    expect(Math.abs(f - F), `F(${k}) = ${f}, table ${F}, tolerance 1e-4`).toBeLessThan(1e-4);
    expect(Math.abs(g - G), `G(${k}) = ${g}, table ${G}, tolerance 1e-4`).toBeLessThan(1e-4);
  });

  it("agrees with mpmath's Hankel functions (40 digits) to 1e-10 from k = 1e-9 to 1e5", () => {
    const out = new Float64Array(2);
    const work = new Float64Array(4);
    for (const row of reference.theodorsen) {
      theodorsen(row.k, out, work);
      const error = Math.max(Math.abs(out[0] - row.F), Math.abs(out[1] - row.G));
      expect(error, `k = ${row.k}: F ${out[0]} vs ${row.F}, G ${out[1]} vs ${row.G}`).toBeLessThan(1e-10);
    }
  });

  it("has the limits C(0) = 1 and C(∞) = ½ (Theodorsen 1935)", () => {
    expect(Array.from(theodorsen(0))).toEqual([1, 0]);
    const [f, g] = theodorsen(1e8);
    expect(Math.abs(f - 0.5)).toBeLessThan(1e-9);
    expect(Math.abs(g)).toBeLessThan(1e-8);
  });

  it("rejects negative, NaN and infinite k", () => {
    for (const k of [-0.1, Number.NaN, Infinity]) expect(() => theodorsen(k)).toThrow(/k ≥ 0/);
  });
});
