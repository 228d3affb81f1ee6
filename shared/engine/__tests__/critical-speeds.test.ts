import { describe, expect, it } from "vitest";
import { runSweep } from "../run-sweep";
import { selbergSpeed } from "../selberg-speed";
import type { StudyDocument } from "../../schemas/study";
import { benchmarkDeck, relativeError } from "./support/benchmark-deck";

const quasiSteady = (liftSlope: number, dragCoefficient: number, momentSlope: number) =>
  ({ model: "quasi-steady", liftSlope, dragCoefficient, momentSlope }) as const;

describe("Selberg's estimate against thin-plate flutter", () => {
  // Selberg 1961, Acta Polytechnica Scandinavica Ci 13 (form of docs/conventions.md §Selberg, from memory). Against exact
  // thin-plate flutter (ρ = 1.225, ζ = 0) it is within ~1–3 % for f_α/f_h ≥ 2 [docs/conventions.md §Selberg, computed].
  it.each([2, 2.5, 3])("is within 3 %% of the flat-plate flutter speed at f_α/f_h = %s", (ratio) => {
    const study = benchmarkDeck({ density: 1.225, damping: 0, heaveHz: 0.278 / ratio, step: 1 });
    const result = runSweep(study);
    const expected = selbergSpeed(22740, 2.47e6, 0.278 / ratio, 0.278, 1.225, 31)!;
    expect(result.selberg).toBe(expected);
    const error = relativeError(expected, result.flutter!.speed);
    expect(error, `Selberg ${expected} vs flat plate ${result.flutter!.speed}`).toBeLessThan(0.03);
  });

  it("is null when the torsional frequency does not exceed the heave frequency", () => {
    expect(runSweep(benchmarkDeck({ heaveHz: 0.3, to: 20, step: 1 })).selberg).toBeNull();
  });
});

describe("divergence", () => {
  it("equals U = √(2Iω_α²/(ρB²S)) (docs/conventions.md §Divergence; EN 1991-1-4:2005 E.4.3 Expr. (E.24)) with S = momentSlope", () => {
    const study: StudyDocument = { ...benchmarkDeck({ to: 200 }), aerodynamics: quasiSteady(5, 0.1, 1.2) };
    const result = runSweep(study);
    const omega = 2 * Math.PI * 0.278;
    const closedForm = Math.sqrt((2 * 2.47e6 * omega * omega) / (1.22 * 31 * 31 * 1.2));
    expect(result.divergence?.speed).toBeCloseTo(closedForm, 9);
    // quasi-steady data have K²H4* = K²A4* = 0, so the static balance is exactly the closed form: the sweep's real
    // root must cross zero there too
    const crossing = result.warnings.find((w) => w.code === "static-instability");
    expect(crossing, JSON.stringify(result.warnings)).toBeDefined();
    expect(Math.abs(crossing!.speeds![0] - closedForm), `sweep ${crossing!.speeds![0]} vs ${closedForm}`).toBeLessThan(1e-3);
  });

  it("is null when the static moment slope is not positive or the speed is outside the sweep", () => {
    expect(runSweep({ ...benchmarkDeck({ to: 60, step: 1 }), aerodynamics: quasiSteady(5, 0.1, -0.5) }).divergence).toBeNull();
    expect(runSweep(benchmarkDeck({ to: 60, step: 1 })).divergence).toBeNull();
  });
});

describe("galloping with quasi-steady data", () => {
  it("loses heave damping at U = 4mζω_h/(ρB|C_L′ + C_D|) when C_L′ + C_D < 0 (Den Hartog's criterion)", () => {
    // Den Hartog, Mechanical Vibrations (galloping criterion dC_L/dα + C_D < 0); onset as EN 1991-1-4:2005 E.2.2
    // v_CG = 2 Sc n b / a_G with a_G = −(C_L′ + C_D) and b = B. With C_M′ = 0 the moment row carries no heave
    // term, so the heave pole obeys the 1-DOF equation exactly.
    const base = benchmarkDeck({ damping: 0.01, to: 60, step: 1 });
    const result = runSweep({ ...base, aerodynamics: quasiSteady(-1, 0.5, 0) });
    const omega = 2 * Math.PI * 0.1;
    const onset = (4 * 22740 * 0.01 * omega) / (1.22 * 31 * 0.5);
    expect(result.flutter?.speed).toBeCloseTo(onset, 3);
    expect(result.flutter?.mode).toBe("V1");
    expect(result.flutter?.kind).toBe("heave");
    expect(result.warnings.map((w) => w.code)).toContain("quasi-steady-flutter");
  });

  it("keeps heave damping growing with speed when C_L′ + C_D > 0 (stable in Den Hartog's sense)", () => {
    const result = runSweep({ ...benchmarkDeck({ to: 40, step: 1 }), aerodynamics: quasiSteady(5, 0.1, 0) });
    const heave = result.modes[0].steps;
    for (let i = 1; i < heave.length; i++) expect(heave[i].damping).toBeGreaterThan(heave[i - 1].damping);
    expect(result.flutter).toBeNull();
  });
});

describe("critical-speed rules of the result", () => {
  it("reports the first speed with unstable-at-start when a branch is already unstable there", () => {
    const ur = [1, 4, 8, 16];
    const study: StudyDocument = {
      ...benchmarkDeck({ from: 40, to: 60, step: 1 }),
      aerodynamics: { model: "tabulated", interpolation: "linear", reducedVelocity: ur, A2: [0.5, 0.5, 0.5, 0.5], H1: [-1, -2, -4, -8] },
    };
    const result = runSweep(study);
    expect(result.flutter).toMatchObject({ speed: 40, mode: "T1", kind: "torsional" });
    expect(result.warnings.map((w) => w.code)).toContain("unstable-at-start");
  });

  it("names each speed range where a tracked mode used extrapolated derivatives, and only those", () => {
    const ur = [4, 6, 8, 10, 12];
    const study: StudyDocument = {
      ...benchmarkDeck({ from: 1, to: 100, step: 1 }),
      aerodynamics: {
        model: "tabulated",
        interpolation: "linear",
        reducedVelocity: ur,
        H1: ur.map((u) => -0.3 * u),
        A2: ur.map((u) => -0.05 * u),
        A3: ur.map((u) => 0.02 * u * u),
      },
    };
    const result = runSweep(study);
    const ranges = result.warnings.filter((w) => w.code === "extrapolated-derivatives").map((w) => w.speeds!);
    expect(ranges.length).toBeGreaterThan(0);
    const inRange = (u: number) => ranges.some(([a, b]) => u >= a && u <= b);
    const steps = result.modes[0].steps;
    steps.forEach((_, k) => {
      const outside = result.modes.some((m) => {
        const s = m.steps[k];
        const urStep = s.frequency > 0 ? s.speed / (s.frequency * 31) : Number.POSITIVE_INFINITY;
        return urStep < 4 * (1 - 1e-9) || urStep > 12 * (1 + 1e-9);
      });
      expect(inRange(steps[k].speed), `speed ${steps[k].speed}`).toBe(outside);
    });
  });
});
