import { describe, expect, it } from "vitest";
import { convertConvention, type DeliveredDerivatives } from "../convert-convention";
import { createFlatPlateModel } from "../flat-plate";

const NAMES = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;

describe("convertConvention", () => {
  it("passes a set already in our convention through unchanged", () => {
    const set: DeliveredDerivatives = {
      abscissa: "Ur", normalisation: "B", sign: "h-down",
      abscissaValues: [2, 5], H1: [-1, -3], A3: [0.2, 0.9],
    };
    expect(convertConvention(set)).toEqual({ reducedVelocity: [2, 5], H1: [-1, -3], A3: [0.2, 0.9] });
  });

  it("converts each abscissa (hand-computed: Ur-half 10 → 5, K = π → 2, k-half 0.5 → 2π)", () => {
    const ur = (abscissa: DeliveredDerivatives["abscissa"], value: number) =>
      convertConvention({ abscissa, normalisation: "B", sign: "h-down", abscissaValues: [value] }).reducedVelocity[0];
    expect(ur("Ur-half", 10)).toBe(5);
    expect(ur("K", Math.PI)).toBeCloseTo(2, 15);
    expect(ur("k-half", 0.5)).toBeCloseTo(2 * Math.PI, 15);
  });

  it("doubles 2B-normalised values (Scanlan & Tomko 1971; Simiu & Scanlan) and flips H2*, H3*, A1*, A4* for h up", () => {
    const ones = [1];
    const set: DeliveredDerivatives = {
      abscissa: "Ur", normalisation: "2B", sign: "h-up", abscissaValues: [4],
      H1: ones, H2: ones, H3: ones, H4: ones, A1: ones, A2: ones, A3: ones, A4: ones,
    };
    const out = convertConvention(set);
    // Hand-computed from L = −L_up, h = −h_up, then ×2 for the 2B normalisation.
    expect(NAMES.map((name) => out[name]![0])).toEqual([2, -2, -2, 2, -2, 2, 2, -2]);
  });

  it("reorders rows by increasing Ur when the abscissa is a reduced frequency", () => {
    const out = convertConvention({
      abscissa: "K", normalisation: "B", sign: "h-down",
      abscissaValues: [0.5, 1, 2], A2: [-0.9, -0.3, -0.1],
    });
    expect(out.reducedVelocity.map((u) => u / Math.PI)).toEqual([1, 2, 4]);
    expect(out.A2).toEqual([-0.1, -0.3, -0.9]);
  });

  it("round trip: the flat plate written as Scanlan & Tomko would (2B, half chord, h up) converts back to ours", () => {
    const plate = createFlatPlateModel();
    const ks = [1.2, 0.6, 0.35, 0.2, 0.12]; // k = bω/U, decreasing (increasing Ur)
    const ours = ks.map((k) => plate.derivatives(2 * k));
    const flip = { H2: -1, H3: -1, A1: -1, A4: -1 } as Record<string, number>;
    const delivered: DeliveredDerivatives = { abscissa: "k-half", normalisation: "2B", sign: "h-up", abscissaValues: ks };
    for (const name of NAMES) delivered[name] = ours.map((d) => (d[name] * (flip[name] ?? 1)) / 2);
    const back = convertConvention(delivered);
    back.reducedVelocity.forEach((u, i) => expect(u).toBeCloseTo(Math.PI / ks[i], 13));
    for (const name of NAMES) {
      back[name]!.forEach((value, i) => expect(value, `${name}* row ${i}`).toBeCloseTo(ours[i][name], 13));
    }
  });

  it("rejects unequal columns, non-positive or repeated abscissae, and non-finite values", () => {
    const base = { abscissa: "Ur", normalisation: "B", sign: "h-down" } as const;
    expect(() => convertConvention({ ...base, abscissaValues: [1, 2], H1: [1] })).toThrow(/H1 has 1 values for 2/);
    expect(() => convertConvention({ ...base, abscissaValues: [1, 0] })).toThrow(/row 2 must be finite and > 0/);
    expect(() => convertConvention({ ...base, abscissaValues: [3, 1, 3] })).toThrow(/rows 1 and 3/);
    expect(() => convertConvention({ ...base, abscissaValues: [1, 2], A2: [1, Number.NaN] })).toThrow(/A2 row 2/);
  });
});
