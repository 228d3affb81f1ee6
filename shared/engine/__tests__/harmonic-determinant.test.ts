/**
 * The engine's harmonic-determinant solver (core/neutral-point.ts, n modes) against the independent second route
 * of the test support (support/flutter-determinant.ts: the quartic in U per K by Durand–Kerner, scanned in K).
 * The two share only the equations (docs/method-and-validation.md §1); agreement required: 1e-6 relative.
 */
import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { solveNeutralPoint } from "../core/neutral-point";
import { generalizedSystem, type GeneralizedModeInput } from "../generalized";
import { sectionSystem } from "../section-system";
import type { StudyDocument } from "../../schemas/study";
import { benchmarkDeck } from "./support/benchmark-deck";
import { determinantFlutterPoint } from "./support/flutter-determinant";

const start = (speedMps: number, hz: number, n: number, torsion: number) => {
  const vecRe = new Float64Array(n).fill(0.1);
  vecRe[torsion] = 1;
  return { speedMps, omegaRadS: 2 * Math.PI * hz, vecRe, vecIm: new Float64Array(n) };
};

describe("harmonic determinant det Z(U, ω) = 0, engine solver against the test route", () => {
  // the solver is local (it follows one root in K from its start): started 7 % below the speed and 5 % above the
  // frequency of the route's point
  it.each([
    { name: "benchmark deck (flat plate)", study: benchmarkDeck() },
    { name: "benchmark deck, f_h = 0.2 Hz, ζ = 0", study: benchmarkDeck({ heaveHz: 0.2, damping: 0 }) },
  ])("$name: same neutral speed and frequency", ({ study }) => {
    const aero = createAeroModel(study.aerodynamics);
    const route = determinantFlutterPoint(study as StudyDocument, aero, [(2 * Math.PI) / 60, 2 * Math.PI]);
    const point = solveNeutralPoint(sectionSystem(study, aero), start(0.93 * route!.speed, 1.05 * route!.frequency, 2, 1));
    expect(point, "engine").not.toBeNull();
    expect(Math.abs(point!.speedMps - route!.speed) / route!.speed, `${point!.speedMps} vs ${route!.speed}`).toBeLessThan(1e-6);
    const hz = point!.omegaRadS / (2 * Math.PI);
    expect(Math.abs(hz - route!.frequency) / route!.frequency, `${hz} vs ${route!.frequency} Hz`).toBeLessThan(1e-6);
  });

  it("solves a 4-mode bridge (V1, T1 sine; V2, T2 antisymmetric): the symmetric pair gives the 2-DOF point", () => {
    const span = 1000;
    const stations = Float64Array.from({ length: 201 }, (_, i) => (i * span) / 200);
    const sine = (k: number) => Float64Array.from(stations, (x) => Math.sin((k * Math.PI * x) / span));
    const zero = new Float64Array(stations.length);
    const mode = (id: string, k: number, hz: number, torsion: boolean): GeneralizedModeInput => ({
      id, frequencyHz: hz, damping: 0.003, heave: torsion ? zero : sine(k), torsion: torsion ? sine(k) : zero,
    });
    const system = generalizedSystem({
      stationsM: stations, widthM: 31, massKgPerM: 22740, inertiaKgM2PerM: 2.47e6, densityKgM3: 1.22,
      modes: [mode("V1", 1, 0.1, false), mode("T1", 1, 0.278, true), mode("V2", 2, 0.14, false), mode("T2", 2, 0.36, true)],
      aero: createAeroModel({ model: "flat-plate" }),
    });
    const study = benchmarkDeck();
    const route = determinantFlutterPoint(study, createAeroModel(study.aerodynamics), [(2 * Math.PI) / 60, 2 * Math.PI]);
    const point = solveNeutralPoint(system, start(0.93 * route!.speed, 1.05 * route!.frequency, 4, 1));
    expect(Math.abs(point!.speedMps - route!.speed) / route!.speed, `${point!.speedMps} vs ${route!.speed}`).toBeLessThan(1e-6);
    // the antisymmetric coordinates take no part in it
    expect(Math.hypot(point!.vecRe[2], point!.vecIm[2], point!.vecRe[3], point!.vecIm[3])).toBeLessThan(1e-9);
  });

  it("returns null where no neutral point lies within the searched span (still air)", () => {
    const study = { ...benchmarkDeck(), air: { density: 0 } };
    expect(solveNeutralPoint(sectionSystem(study, createAeroModel(study.aerodynamics)), start(70, 0.2, 2, 1))).toBeNull();
  });
});
