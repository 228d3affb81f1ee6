import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { runSweep } from "../run-sweep";
import { benchmarkDeck, relativeError } from "./support/benchmark-deck";

// Reference values: docs/conventions.md §Benchmark deck, "computed by an independent reference" (not published values; the paper's
// participants' results were not checked). Tolerance 0.1 %.
const TOLERANCE = 1e-3;

function expectClose(actual: number | undefined, expected: number, what: string) {
  expect(actual, `${what}: no value`).toBeDefined();
  const error = relativeError(actual!, expected);
  expect(error, `${what}: ${actual} vs ${expected} (relative error ${error.toExponential(2)} > ${TOLERANCE})`).toBeLessThan(
    TOLERANCE,
  );
}

describe("benchmark deck of the IABSE TG 3.1 2-DOF benchmark (inputs from docs/conventions.md §Benchmark deck), flat plate", () => {
  it("flutters at 77.24 m/s and 0.1936 Hz (K = 0.4881) with ζ = 0.3 %, coupled, from the torsion branch", () => {
    const result = runSweep(benchmarkDeck());
    const flutter = result.flutter!;
    expectClose(flutter.speed, 77.24, "flutter speed");
    expectClose(flutter.frequency, 0.1936, "flutter frequency");
    const k = (31 * 2 * Math.PI * flutter.frequency) / flutter.speed;
    expectClose(k, 0.4881, "reduced frequency K = Bω/U");
    expect(flutter.mode).toBe("T1");
    expect(flutter.kind).toBe("coupled");
    expect(flutter.reducedVelocity).toBeCloseTo(flutter.speed / (flutter.frequency * 31), 9);
  });

  it("flutters at 76.68 m/s without structural damping and at 75.77 m/s with ρ = 1.25", () => {
    expectClose(runSweep(benchmarkDeck({ damping: 0 })).flutter?.speed, 76.68, "ζ = 0");
    expectClose(runSweep(benchmarkDeck({ damping: 0, density: 1.25 })).flutter?.speed, 75.77, "ζ = 0, ρ = 1.25");
  });

  it("gives the divergence closed form 90.47 m/s, and the sweep's static root crosses zero close to it", () => {
    const result = runSweep(benchmarkDeck());
    expectClose(result.divergence?.speed, 90.47, "divergence");
    const crossing = result.warnings.find((w) => w.code === "static-instability");
    // the sweep adds H3*, H4*, A4* to the static balance: near, not equal (within 1 %)
    expect(crossing?.speeds?.[0]).toBeDefined();
    expect(relativeError(crossing!.speeds![0], 90.47)).toBeLessThan(0.01);
  });

  it.each([
    [0.8, 69.31],
    [1.2, 84.47],
  ])("scales mass and inertia by %s → %s m/s", (factor, expected) => {
    expectClose(runSweep(benchmarkDeck({ massFactor: factor })).flutter?.speed, expected, `mass ×${factor}`);
  });

  it.each([
    [0.15, 70.36],
    [0.2, 59.94],
    [0.25, 48.13],
  ])("with f_h = %s Hz flutters at %s m/s", (heaveHz, expected) => {
    expectClose(runSweep(benchmarkDeck({ heaveHz })).flutter?.speed, expected, `f_h = ${heaveHz} Hz`);
  });

  it("reports at every speed poles of the state matrix at the branch's own K = Bω/U (ml-matrix EVD)", () => {
    const study = benchmarkDeck({ step: 2 });
    const result = runSweep(study);
    const aero = createAeroModel(study.aerodynamics);
    const [m, I, rho, B] = [22740, 2.47e6, 1.22, 31];
    for (const mode of result.modes) {
      for (const s of mode.steps) {
        const k = Math.max((B * s.im) / s.speed, 1e-3);
        const p = aero.products(k);
        const q = 0.5 * rho * s.speed ** 2;
        const c = 0.5 * rho * s.speed * B;
        const wh = 2 * Math.PI * 0.1;
        const wa = 2 * Math.PI * 0.278;
        // x = [h, α]; docs/conventions.md §Equations of motion
        const kt = [m * wh * wh - q * p.k2H4, -q * B * p.k2H3, -q * B * p.k2A4, I * wa * wa - q * B * B * p.k2A3];
        const ct = [2 * m * 0.003 * wh - c * p.kH1, -c * B * p.kH2, -c * B * p.kA1, 2 * I * 0.003 * wa - c * B * B * p.kA2];
        const a = new Matrix([
          [0, 0, 1, 0],
          [0, 0, 0, 1],
          [-kt[0] / m, -kt[1] / m, -ct[0] / m, -ct[1] / m],
          [-kt[2] / I, -kt[3] / I, -ct[2] / I, -ct[3] / I],
        ]);
        const evd = new EigenvalueDecomposition(a);
        const distance = Math.min(...evd.realEigenvalues.map((re, e) => Math.hypot(re - s.re, evd.imaginaryEigenvalues[e] - s.im)));
        expect(distance, `${mode.id} at ${s.speed} m/s`).toBeLessThan(1e-8 * Math.hypot(s.re, s.im));
      }
    }
  });
});
