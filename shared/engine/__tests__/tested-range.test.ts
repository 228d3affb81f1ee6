/**
 * Whether a critical point rests on tested data: `flutter.insideTestedRange`, the per-branch extrapolation
 * warnings, and the closed-form divergence outside the swept range (`divergenceOutsideSweep`).
 *
 * References: the benchmark deck of docs/conventions.md §Benchmark deck (IABSE TG 3.1 inputs; flutter 77.24 m/s at
 * K = 0.4881, i.e. Ur = 12.87, and flat-plate divergence 90.47 m/s at ρ = 1.22 — computed by an independent
 * reference), with its thin-plate derivatives tabulated from Theodorsen's closed forms (docs/conventions.md §Flat plate).
 */
import { describe, expect, it } from "vitest";
import { createFlatPlateModel } from "../aero/flat-plate";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { benchmarkDeck, relativeError } from "./support/benchmark-deck";
import { inventedDeckB } from "./support/invented-deck-b";

/** The benchmark deck with the flat plate's derivatives tabulated at the given reduced velocities (linear in Ur). */
function tabulatedPlate(ur: number[]): StudyDocument {
  const plate = createFlatPlateModel();
  const rows = ur.map((u) => plate.derivatives((2 * Math.PI) / u));
  const column = (name: keyof (typeof rows)[number]) => rows.map((r) => r[name]);
  return {
    ...benchmarkDeck({ step: 0.5, to: 120 }),
    aerodynamics: {
      model: "tabulated",
      interpolation: "monotone-cubic",
      reducedVelocity: ur,
      H1: column("H1"), H2: column("H2"), H3: column("H3"), H4: column("H4"),
      A1: column("A1"), A2: column("A2"), A3: column("A3"), A4: column("A4"),
      staticMomentSlope: Math.PI / 2,
    },
  };
}

const range = (from: number, to: number, step: number) => Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);

describe("flutter.insideTestedRange", () => {
  it("is true when the flutter pole's Ur lies inside the table (thin plate tabulated up to Ur 20: 77.24 m/s reproduced)", () => {
    const result = runSweep(tabulatedPlate(range(1, 20, 0.25)));
    const flutter = result.flutter!;
    expect(relativeError(flutter.speed, 77.24), `flutter ${flutter.speed} m/s`).toBeLessThan(0.005);
    expect(flutter.reducedVelocity).toBeGreaterThan(1);
    expect(flutter.reducedVelocity).toBeLessThan(20);
    expect(flutter.insideTestedRange).toBe(true);
  });

  it("is false when the flutter point lies beyond the table's last row, and the warning names that branch with its Ur range", () => {
    const result = runSweep(tabulatedPlate(range(1, 8, 0.25)));
    const flutter = result.flutter!;
    // Beyond Ur 8 the products are held at the last row, so the speed differs from the full plate's; its Ur is beyond 8.
    expect(flutter.reducedVelocity).toBeGreaterThan(8);
    expect(flutter.insideTestedRange).toBe(false);
    const onBranch = result.warnings.filter((w) => w.code === "extrapolated-derivatives" && w.branch === flutter.mode);
    const covering = onBranch.find((w) => w.speeds![0] <= flutter.speed && flutter.speed <= w.speeds![1]);
    expect(covering, JSON.stringify(onBranch)).toBeDefined();
    expect(covering!.reducedVelocities![0]).toBeGreaterThan(8);
    expect(covering!.message).toContain(`Branch ${flutter.mode}`);
    expect(covering!.message).toContain("above the highest tested Ur 8");
  });

  it("is null for a model without a table (thin plate)", () => {
    const result = runSweep(benchmarkDeck({ to: 100 }));
    expect(result.flutter!.insideTestedRange).toBeNull();
    expect(result.warnings.some((w) => w.code === "extrapolated-derivatives")).toBe(false);
  });

  it("is true for the invented deck B: its torsional branch leaves the table only above the flutter speed", () => {
    const study = inventedDeckB();
    const result = runSweep(study);
    const flutter = result.flutter!;
    expect(flutter.mode).toBe("TS1");
    expect(flutter.insideTestedRange).toBe(true);
    expect(flutter.reducedVelocity).toBeGreaterThan(2);
    expect(flutter.reducedVelocity).toBeLessThan(16);
    const extrapolated = result.warnings.filter((w) => w.code === "extrapolated-derivatives");
    // One warning per branch and range; each range's first step is the branch's first step beyond the table, read
    // independently from the result's steps as Ur = U/(fB).
    for (const w of extrapolated) {
      const steps = result.modes.find((m) => m.id === w.branch)!.steps;
      const first = steps.findIndex((s) => s.speed === w.speeds![0]);
      const ur = (k: number) => steps[k].speed / (steps[k].frequency * study.deck.width);
      if (w.speeds![0] > study.sweep.from) {
        expect(ur(first)).toBeGreaterThan(16);
        expect(ur(first - 1)).toBeLessThanOrEqual(16 * (1 + 1e-9));
      } else {
        expect(ur(first)).toBeLessThan(2);
      }
    }
    const above = extrapolated.find((w) => w.branch === "TS1" && w.speeds![0] > 20)!;
    expect(above.speeds![0]).toBeGreaterThan(flutter.speed);
    const heave = extrapolated.find((w) => w.branch === "VS1" && w.speeds![0] > 20)!;
    expect(heave.speeds![0]).toBeLessThan(flutter.speed);
  });
});

describe("divergence outside the sweep", () => {
  it("is given in divergenceOutsideSweep when the closed form lies beyond the sweep end, and in divergence inside it", () => {
    const short = runSweep(benchmarkDeck({ to: 80 }));
    expect(short.divergence).toBeNull();
    expect(relativeError(short.divergenceOutsideSweep!.speed, 90.47)).toBeLessThan(1e-3);
    const long = runSweep(benchmarkDeck({ to: 100 }));
    expect(relativeError(long.divergence!.speed, 90.47)).toBeLessThan(1e-3);
    expect(long.divergenceOutsideSweep).toBeNull();
  });
});
