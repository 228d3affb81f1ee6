import { describe, expect, it } from "vitest";
import { emptyProducts } from "../derivative-products";
import { createTabulatedModel, type TabulatedAerodynamics } from "../tabulated";

const TWO_PI = 2 * Math.PI;
const kOf = (ur: number) => TWO_PI / ur;

function table(overrides: Partial<TabulatedAerodynamics> = {}): TabulatedAerodynamics {
  return {
    model: "tabulated",
    interpolation: "linear",
    reducedVelocity: [2, 3.5, 6, 9, 14],
    ...overrides,
  };
}

describe("tabulated model", () => {
  it("linear interpolation reproduces linear data exactly, every derivative, any spacing", () => {
    const ur = [2, 3.5, 6, 9, 14];
    const line = (a: number, b: number) => ur.map((u) => a + b * u);
    for (const interpolation of ["linear", "monotone-cubic"] as const) {
      const model = createTabulatedModel(
        table({ interpolation, H1: line(0.3, -0.9), A2: line(0.1, -0.12), H3: line(-1, -0.8), A4: line(0.05, 0.02) }),
      );
      for (const u of [2.2, 3.5, 4.9, 7.3, 13.99]) {
        const d = model.derivatives(kOf(u));
        const want = { H1: 0.3 - 0.9 * u, A2: 0.1 - 0.12 * u, H3: -1 - 0.8 * u, A4: 0.05 + 0.02 * u };
        for (const [name, value] of Object.entries(want)) {
          const got = d[name as keyof typeof d];
          expect(Math.abs(got - value), `${interpolation} ${name} at Ur = ${u}: ${got} vs ${value}`).toBeLessThan(1e-12);
        }
        expect(d.H2).toBe(0); // missing arrays are zeros
      }
    }
  });

  it("monotone cubic passes through every node and keeps monotone data monotone (no overshoot)", () => {
    // Steep-then-flat data, where an ordinary cubic spline overshoots.
    const reducedVelocity = [1, 2, 3, 4, 6, 8, 12, 16];
    const A2 = [0, -0.02, -0.05, -0.9, -1.0, -1.0, -1.05, -2.4];
    const model = createTabulatedModel(table({ interpolation: "monotone-cubic", reducedVelocity, A2 }));
    reducedVelocity.forEach((u, i) => {
      expect(Math.abs(model.derivatives(kOf(u)).A2 - A2[i]), `node Ur = ${u}`).toBeLessThan(1e-12);
    });
    let previous = Infinity;
    for (let u = 1; u <= 16; u += 0.01) {
      const value = model.derivatives(kOf(u)).A2;
      expect(value, `A2* must not increase at Ur = ${u.toFixed(2)}`).toBeLessThanOrEqual(previous + 1e-13);
      previous = value;
    }
    // On the flat piece [6, 8] the interpolant stays flat.
    expect(Math.abs(model.derivatives(kOf(7)).A2 + 1)).toBeLessThan(1e-12);
  });

  it("holds the products K·H1*, K·H2*, K²H3*, K²H4*, K·A1*, K·A2*, K²A3*, K²A4* outside the table", () => {
    const reducedVelocity = [2, 6, 10];
    const model = createTabulatedModel(
      table({
        reducedVelocity,
        H1: [-1, -3, -5], H2: [0.2, -0.4, -1], H3: [-0.5, -3, -9], H4: [0.3, 0.1, -0.2],
        A1: [0.2, 0.7, 1.3], A2: [-0.05, -0.3, -0.6], A3: [0.1, 0.8, 2.1], A4: [0.01, 0.05, 0.12],
      }),
    );
    const Khigh = kOf(10);
    const high = model.products(Khigh);
    expect(high.kH1).toBeCloseTo(Khigh * -5, 14);
    expect(high.k2H3).toBeCloseTo(Khigh * Khigh * -9, 14);
    expect(high.kA2).toBeCloseTo(Khigh * -0.6, 14);
    expect(high.k2A3).toBeCloseTo(Khigh * Khigh * 2.1, 14);
    for (const K of [Khigh / 2, Khigh / 1000, 0]) expect(model.products(K)).toEqual(high);
    const low = model.products(kOf(2));
    for (const K of [kOf(1.5), kOf(0.1)]) expect(model.products(K)).toEqual(low);
    expect(model.isExtrapolated(kOf(1.99))).toBe(true);
    expect(model.isExtrapolated(kOf(10.01))).toBe(true);
    expect(model.isExtrapolated(0)).toBe(true);
    expect(model.isExtrapolated(kOf(2))).toBe(false);
    expect(model.isExtrapolated(kOf(10))).toBe(false);
    expect(model.isExtrapolated(kOf(5))).toBe(false);
    expect(model.reducedVelocityRange).toEqual([2, 10]);
    // Static moment slope: K²A3* at the largest Ur unless given.
    expect(model.staticMomentSlope).toBeCloseTo(Khigh * Khigh * 2.1, 14);
    expect(createTabulatedModel(table({ staticMomentSlope: 0.9 })).staticMomentSlope).toBe(0.9);
  });

  it("gives the same values whatever order it is asked in (interval cache) and writes into the given record", () => {
    const model = createTabulatedModel(
      table({ interpolation: "monotone-cubic", H1: [-1, -2.2, -4, -6.5, -9], A3: [0.05, 0.3, 0.9, 1.7, 3] }),
    );
    const us = [13, 2.5, 8, 3.6, 13.5, 6.1, 2.01];
    const forward = us.map((u) => model.derivatives(kOf(u)));
    const backward = [...us].reverse().map((u) => model.derivatives(kOf(u))).reverse();
    expect(backward).toEqual(forward);
    const out = emptyProducts();
    expect(model.products(kOf(5), out)).toBe(out);
  });

  it("rejects tables the schema would reject, with a plain message", () => {
    expect(() => createTabulatedModel(table({ reducedVelocity: [3] }))).toThrow(/at least 2 rows/);
    expect(() => createTabulatedModel(table({ reducedVelocity: [3, 3] }))).toThrow(/reducedVelocity\[1\]/);
    expect(() => createTabulatedModel(table({ H4: [1, 2] }))).toThrow(/H4 has 2 values for 5 rows/);
    expect(() => createTabulatedModel(table({ A1: [1, 2, Number.NaN, 4, 5] }))).toThrow(/A1\[2\]/);
  });
});
