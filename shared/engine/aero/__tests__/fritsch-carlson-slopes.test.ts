import { describe, expect, it } from "vitest";
import { fritschCarlsonSlopes } from "../fritsch-carlson-slopes";

describe("fritschCarlsonSlopes (Fritsch & Carlson 1980, SIAM J. Numer. Anal. 17(2))", () => {
  it("gives the secants' mean inside and the one-sided secants at the ends on mild data", () => {
    // Hand-computed: secants 1, 2 → interior slope 1.5; α, β stay inside the circle α² + β² ≤ 9.
    expect(Array.from(fritschCarlsonSlopes([0, 1, 2], [0, 1, 3]))).toEqual([1, 1.5, 2]);
  });

  it("sets zero slopes at an extremum and on a flat piece", () => {
    // Hand-computed: secants 1, 0, 1 → interior slopes 0 (sign rule and flat interval).
    expect(Array.from(fritschCarlsonSlopes([0, 1, 2, 3], [0, 1, 1, 2]))).toEqual([1, 0, 0, 1]);
    expect(Array.from(fritschCarlsonSlopes([0, 1, 2], [0, 1, 0]))).toEqual([1, 0, -1]);
  });

  it("scales both slopes onto the circle α² + β² = 9 where they are too steep", () => {
    // Hand-computed: secants 0.1, 1.9; initial slopes 0.1, 1.0, 1.9; on [0, 1] α = 1, β = 10 → τ = 3/√101.
    const tau = 3 / Math.sqrt(101);
    const slopes = fritschCarlsonSlopes([0, 1, 2], [0, 0.1, 2]);
    expect(slopes[0]).toBeCloseTo(tau * 0.1, 14);
    expect(slopes[1]).toBeCloseTo(tau * 1.0, 14);
    expect(slopes[2]).toBe(1.9);
  });

  it("rejects fewer than two nodes or unequal lengths", () => {
    expect(() => fritschCarlsonSlopes([1], [1])).toThrow(/≥ 2 nodes/);
    expect(() => fritschCarlsonSlopes([1, 2], [1])).toThrow(/equal lengths/);
  });
});
