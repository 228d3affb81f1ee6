import { describe, expect, it } from "vitest";
import { emptyProducts } from "../derivative-products";
import { createFlatPlateModel, FLAT_PLATE_LOG_TERM_FLOOR_K } from "../flat-plate";
import { theodorsen } from "../theodorsen";
import type { FlutterDerivatives } from "../types";

const model = createFlatPlateModel();
const NAMES = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;

type Complex = [re: number, im: number];
const mul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const add = (...terms: Complex[]): Complex => terms.reduce((s, t) => [s[0] + t[0], s[1] + t[1]], [0, 0]);
const real = (x: number): Complex => [x, 0];

/**
 * Theodorsen's lift and moment on a plate oscillating harmonically, as written in Bisplinghoff, Ashley &
 * Halfman, Aeroelasticity (1955), ch. 5: h down, L up, α and M nose-up, elastic axis at b·a from mid-chord:
 *   L = πρb²(ḧ + Uα̇ − baα̈) + 2πρUbC(k)[ḣ + Uα + b(½ − a)α̇]
 *   M = πρb²[baḧ − Ub(½ − a)α̇ − b²(⅛ + a²)α̈] + 2πρUb²(a + ½)C(k)[ḣ + Uα + b(½ − a)α̇]
 * With h = h̄e^{iωt}, α = ᾱe^{iωt} (ḣ = iωh, ḧ = −ω²h) this returns the complex coefficients of h̄ and ᾱ in
 * the downward lift L = −L_up and in M, for a = 0. Scanlan's form in our convention then reads
 *   L_h = ½ρU²K²(H4* + iH1*), L_α = ½ρU²BK²(H3* + iH2*), M_h = ½ρU²BK²(A4* + iA1*), M_α = ½ρU²B²K²(A3* + iA2*).
 */
function derivativesFromTheodorsenForces(K: number): FlutterDerivatives {
  const rho = 1.25;
  const U = 40;
  const B = 24;
  const b = B / 2;
  const a = 0;
  const omega = (K * U) / B;
  const [F, G] = theodorsen(K / 2);
  const C: Complex = [F, G];
  const iw: Complex = [0, omega];
  const w2 = real(-omega * omega);
  // Circulatory bracket Q = ḣ + Uα + b(½ − a)α̇, per unit h̄ and per unit ᾱ.
  const qh = iw;
  const qa = add(real(U), mul(real(b * (0.5 - a)), iw));
  const liftUpH = add(mul(real(Math.PI * rho * b * b), w2), mul(real(2 * Math.PI * rho * U * b), mul(C, qh)));
  const liftUpA = add(
    mul(real(Math.PI * rho * b * b), add(mul(real(U), iw), mul(real(-b * a), w2))),
    mul(real(2 * Math.PI * rho * U * b), mul(C, qa)),
  );
  const momentH = add(
    mul(real(Math.PI * rho * b * b * b * a), w2),
    mul(real(2 * Math.PI * rho * U * b * b * (a + 0.5)), mul(C, qh)),
  );
  const momentA = add(
    mul(real(Math.PI * rho * b * b), add(mul(real(-U * b * (0.5 - a)), iw), mul(real(-b * b * (0.125 + a * a)), w2))),
    mul(real(2 * Math.PI * rho * U * b * b * (a + 0.5)), mul(C, qa)),
  );
  const q = 0.5 * rho * U * U * K * K;
  return {
    H1: -liftUpH[1] / q,
    H4: -liftUpH[0] / q,
    H2: -liftUpA[1] / (q * B),
    H3: -liftUpA[0] / (q * B),
    A1: momentH[1] / (q * B),
    A4: momentH[0] / (q * B),
    A2: momentA[1] / (q * B * B),
    A3: momentA[0] / (q * B * B),
  };
}

describe("flat-plate model", () => {
  it.each([0.05, 0.2, 0.5, 1, 2, 4, 10])(
    "equals Theodorsen's lift and moment (BAH 1955 form, L = −L_up) entry by entry at K = %d",
    (K) => {
      const ours = model.derivatives(K);
      const direct = derivativesFromTheodorsenForces(K);
      for (const name of NAMES) {
        const tolerance = 1e-12 * Math.max(1, Math.abs(direct[name]));
        expect(Math.abs(ours[name] - direct[name]), `${name}* at K = ${K}: ${ours[name]} vs ${direct[name]}`)
          .toBeLessThan(tolerance);
      }
    },
  );

  // docs/conventions.md §Flat plate, table, "computed from the closed forms" — a consistency check, 4 decimals.
  it.each([
    [4, -2.2221, -1.2554, -1.5325, 1.0993, 0.5555, -0.1862, 0.4322, 0.1179],
    [8, -5.019, -1.5633, -6.7225, 0.2423, 1.2548, -0.6092, 1.7297, 0.3321],
    [12, -8.2255, -0.8392, -16.2615, -0.6373, 2.0564, -1.2902, 4.1145, 0.552],
    [16, -11.688, 0.7665, -30.5179, -1.4485, 2.922, -2.1916, 7.6786, 0.7548],
  ])("reproduces the derivative table of docs/conventions.md §Flat plate at Ur = %d", (ur, ...expected) => {
    const ours = model.derivatives((2 * Math.PI) / ur);
    NAMES.forEach((name, i) => {
      expect(Math.abs(ours[name] - expected[i]), `${name}* at Ur = ${ur}: ${ours[name]} vs ${expected[i]}`)
        .toBeLessThan(1e-4);
    });
  });

  it("has the steady limits K²H3* → −2π, K·A1* → π/2, K²A3* → π/2 (thin-aerofoil theory, lift slope 2π)", () => {
    const atZero = model.products(0);
    expect(atZero.k2H3).toBe(-2 * Math.PI);
    expect(atZero.kA1).toBe(Math.PI / 2);
    expect(atZero.k2A3).toBe(Math.PI / 2);
    expect(atZero.kH1).toBe(-2 * Math.PI);
    expect(atZero.k2H4).toBe(0);
    expect(Math.abs(atZero.k2A4)).toBe(0);
    const small = model.products(1e-7);
    expect(Math.abs(small.k2H3 + 2 * Math.PI)).toBeLessThan(1e-5);
    expect(Math.abs(small.kA1 - Math.PI / 2)).toBeLessThan(1e-5);
    expect(Math.abs(small.k2A3 - Math.PI / 2)).toBeLessThan(1e-5);
    expect(model.staticMomentSlope).toBe(Math.PI / 2);
  });

  it("floors only the logarithmic G/K term: K·H2*, K·A2* stay finite and continuous at and below the floor", () => {
    const above = model.products(FLAT_PLATE_LOG_TERM_FLOOR_K * (1 + 1e-9));
    const below = model.products(FLAT_PLATE_LOG_TERM_FLOOR_K * (1 - 1e-9));
    const zero = model.products(0);
    expect(Math.abs(above.kH2 - below.kH2)).toBeLessThan(1e-8);
    expect(Math.abs(above.kA2 - below.kA2)).toBeLessThan(1e-8);
    expect(Number.isFinite(zero.kH2) && Number.isFinite(zero.kA2)).toBe(true);
    // Torsional aerodynamic damping keeps its sign (A2* < 0) all the way down.
    expect(zero.kA2).toBeLessThan(0);
  });

  it("keeps the plate's apparent mass πρB²/4 and inertia πρB⁴/128 as U → 0 (BAH 1955, non-circulatory terms)", () => {
    const rho = 1.2;
    const B = 30;
    const omega = 2;
    const U = 1e-3;
    const p = model.products((B * omega) / U);
    const massPerLength = (0.5 * rho * U * U * p.k2H4) / (omega * omega);
    const inertiaPerLength = (0.5 * rho * U * U * B * B * p.k2A3) / (omega * omega);
    expect(Math.abs(massPerLength / ((Math.PI * rho * B * B) / 4) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(inertiaPerLength / ((Math.PI * rho * B ** 4) / 128) - 1)).toBeLessThan(1e-3);
  });

  it("writes into the given record and returns it", () => {
    const out = emptyProducts();
    expect(model.products(0.4, out)).toBe(out);
    expect(out.kH1).toBeCloseTo(model.derivatives(0.4).H1 * 0.4, 12);
    expect(model.isExtrapolated(0.4)).toBe(false);
    expect(model.reducedVelocityRange).toBeNull();
  });

  it("rejects a negative or non-finite K", () => {
    for (const K of [-1, Number.NaN, Infinity]) expect(() => model.products(K)).toThrow(/reduced frequency K/);
  });
});
