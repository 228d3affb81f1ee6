import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { locateFlutter } from "../core/locate-critical";
import { trackPoles } from "../core/track-poles";
import { generalizedSystem, type GeneralizedModeInput } from "../generalized";
import { sweepGrid } from "../sweep-grid";

// Consistency checks of the multimode formulation, docs/conventions.md §Multimode [computed by an independent reference, benchmark
// deck of §5, ℓ = 1000 m, flat plate]. Modal integrals after Jain, Jones & Scanlan 1996, J. Struct. Eng. 122(7).
const SPAN = 1000;
const stations = Float64Array.from({ length: 201 }, (_, i) => (i * SPAN) / 200);
const sine = (k: number, scale = 1) => Float64Array.from(stations, (x) => scale * Math.sin((k * Math.PI * x) / SPAN));
const zero = new Float64Array(stations.length);
const vertical = (id: string, k: number, hz: number, scale = 1): GeneralizedModeInput => ({
  id, frequencyHz: hz, damping: 0.003, heave: sine(k, scale), torsion: zero,
});
const torsional = (id: string, k: number, hz: number, scale = 1): GeneralizedModeInput => ({
  id, frequencyHz: hz, damping: 0.003, heave: zero, torsion: sine(k, scale),
});

function sweep(modes: GeneralizedModeInput[], to = 150) {
  const system = generalizedSystem({
    stationsM: stations,
    widthM: 31,
    massKgPerM: 22740,
    inertiaKgM2PerM: 2.47e6,
    densityKgM3: 1.22,
    modes,
    aero: createAeroModel({ model: "flat-plate" }),
  });
  const track = trackPoles(system, sweepGrid(10, to, 1));
  return { system, track, flutter: locateFlutter(system, track) };
}

describe("generalized (multimode) system", () => {
  it("sine-shaped V1 + T1 with the same shape reproduce the 2-DOF flutter speed 77.24 m/s", () => {
    const { flutter } = sweep([vertical("V1", 1, 0.1), torsional("T1", 1, 0.278)]);
    expect(Math.abs(flutter!.speedMps - 77.24) / 77.24, `${flutter?.speedMps}`).toBeLessThan(1e-3);
    expect(flutter!.branch).toBe(1);
  });

  it("rescaling a mode shape (with its generalized mass) changes nothing", () => {
    const a = sweep([vertical("V1", 1, 0.1), torsional("T1", 1, 0.278)], 90).flutter!;
    const b = sweep([vertical("V1", 1, 0.1, 3.7), torsional("T1", 1, 0.278, 0.2)], 90).flutter!;
    expect(Math.abs(a.speedMps - b.speedMps)).toBeLessThan(1e-6);
  });

  it("symmetric V1 + antisymmetric T2 do not couple: no flutter, though their frequencies cross", () => {
    // T2 softens under A3* from 0.2 Hz through V1's 0.19 Hz: the tracker must follow shapes, not frequency order
    const { track, flutter, system } = sweep([vertical("V1", 1, 0.19), torsional("T2", 2, 0.2)], 150);
    expect(flutter).toBeNull();
    expect(system.integrals.ha[1]).toBeCloseTo(0, 12);
    const [v, t] = track.branches;
    expect(v.at(-1)!.im).toBeGreaterThan(t.at(-1)!.im); // frequencies have crossed
    for (const s of v) expect(s.vecRe[1] ** 2 + s.vecIm[1] ** 2).toBeLessThan(1e-20);
    for (const s of t) expect(s.vecRe[0] ** 2 + s.vecIm[0] ** 2).toBeLessThan(1e-20);
  });

  it("V1, T1 with antisymmetric V2 (0.14 Hz) and T2 (0.36 Hz): two unstable branches, reports 77.24 m/s", () => {
    const { track, flutter, system } = sweep(
      [vertical("V1", 1, 0.1), torsional("T1", 1, 0.278), vertical("V2", 2, 0.14), torsional("T2", 2, 0.36)],
      110,
    );
    expect(Math.abs(flutter!.speedMps - 77.24) / 77.24).toBeLessThan(1e-3);
    // the antisymmetric branch alone: 98.86 m/s
    const second = locateFlutter(system, { ...track, branches: [track.branches[3]] });
    expect(Math.abs(second!.speedMps - 98.86) / 98.86, `${second?.speedMps}`).toBeLessThan(1e-3);
  });

  it("every tracked pole is an eigenvalue of the state matrix at its own K = Bω/U (checked by ml-matrix EVD)", () => {
    const { system, track } = sweep(
      [vertical("V1", 1, 0.1), torsional("T1", 1, 0.278), vertical("V2", 2, 0.14), torsional("T2", 2, 0.36)],
      110,
    );
    const n = system.size;
    const kae = new Float64Array(n * n);
    const cae = new Float64Array(n * n);
    for (const steps of track.branches) {
      for (const s of steps.filter((_, k) => k % 7 === 0)) {
        const k = Math.max((31 * s.im) / s.speedMps, system.minReducedFrequency);
        expect(Math.abs(k - s.reducedFrequency)).toBeLessThan(1e-8 * k);
        system.aero(s.speedMps, k, kae, cae);
        const a = Matrix.zeros(2 * n, 2 * n);
        for (let i = 0; i < n; i++) {
          a.set(i, n + i, 1);
          const mi = system.mass[i * n + i];
          for (let j = 0; j < n; j++) {
            a.set(n + i, j, -(system.stiffness[i * n + j] - kae[i * n + j]) / mi);
            a.set(n + i, n + j, -(system.damping[i * n + j] - cae[i * n + j]) / mi);
          }
        }
        const evd = new EigenvalueDecomposition(a);
        const distance = Math.min(
          ...evd.realEigenvalues.map((re, e) => Math.hypot(re - s.re, evd.imaginaryEigenvalues[e] - s.im)),
        );
        expect(distance, `pole ${s.re} + ${s.im}i at ${s.speedMps} m/s`).toBeLessThan(1e-8 * Math.hypot(s.re, s.im));
      }
    }
  });
});
