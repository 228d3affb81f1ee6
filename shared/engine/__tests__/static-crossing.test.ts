/**
 * Static instability is reported once per physical crossing. The deck below is the invented demo's alternative B,
 * third revision (invented data, used only to drive the engine): its heave branch reaches the real axis, and its
 * larger real root crosses zero where the static stiffness det(K_s − K_ae) vanishes — one crossing, checked
 * against that determinant solved independently here (derived from the equation of motion, docs/conventions.md
 * §Equations of motion, with the products K²H3*, K²H4*, K²A3*, K²A4* held at the table's last row as the engine does).
 */
import { describe, expect, it } from "vitest";
import type { CriticalPoint } from "../core/locate-critical";
import type { TrackResult, TrackedStep } from "../core/track-poles";
import { runSweep } from "../run-sweep";
import { collectSweepWarnings } from "../sweep-warnings";
import type { StudyDocument } from "../../schemas/study";

const UR = [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16];
const deckB: StudyDocument = {
  format: "stillspan.study/1",
  name: "invented demo deck B, revision 3 (test only)",
  air: { density: 1.225 },
  deck: { width: 29.6, depth: 3.1 },
  structure: {
    mass: 17650,
    inertia: 1.71e6,
    modes: [
      { id: "VS1", dof: "heave", frequency: 0.104, damping: 0.004 },
      { id: "TS1", dof: "torsion", frequency: 0.271, damping: 0.004 },
    ],
  },
  aerodynamics: {
    model: "tabulated",
    interpolation: "monotone-cubic",
    reducedVelocity: UR,
    H1: [-0.78, -1.21, -1.67, -2.15, -2.67, -3.21, -3.76, -4.34, -4.94, -5.55, -6.17, -6.8, -7.45, -8.1, -8.77],
    H2: [-0.43, -0.61, -0.75, -0.86, -0.93, -0.95, -0.94, -0.88, -0.79, -0.67, -0.5, -0.31, -0.08, 0.18, 0.46],
    H3: [-0.38, -0.88, -1.61, -2.58, -3.8, -5.29, -7.06, -9.12, -11.47, -14.12, -17.08, -20.34, -23.92, -27.82, -32.04],
    H4: [0.57, 0.51, 0.44, 0.36, 0.27, 0.19, 0.1, 0.01, -0.08, -0.17, -0.25, -0.34, -0.42, -0.5, -0.58],
    A1: [0.22, 0.34, 0.47, 0.61, 0.76, 0.91, 1.07, 1.23, 1.4, 1.57, 1.75, 1.93, 2.11, 2.3, 2.48],
    A2: [-0.043, -0.073, -0.112, -0.16, -0.218, -0.271, -0.301, -0.31, -0.295, -0.259, -0.198, -0.114, -0.006, 0.127, 0.285],
    A3: [0.141, 0.26, 0.432, 0.662, 0.954, 1.309, 1.73, 2.219, 2.779, 3.41, 4.114, 4.893, 5.745, 6.674, 7.679],
    A4: [0.014, 0.029, 0.047, 0.067, 0.088, 0.11, 0.133, 0.155, 0.178, 0.199, 0.221, 0.242, 0.262, 0.282, 0.302],
  },
  sweep: { from: 1, to: 120, step: 0.5 },
};

/** Root of det(K_s − K_ae(U)) = 0 by bisection, K_ae = ½ρU²[[K²H4*, B K²H3*], [B K²A4*, B² K²A3*]] at the last row. */
function staticRoot(study: StudyDocument, lo: number, hi: number): number {
  const aero = study.aerodynamics as Extract<StudyDocument["aerodynamics"], { model: "tabulated" }>;
  const last = aero.reducedVelocity.length - 1;
  const k2 = (2 * Math.PI / aero.reducedVelocity[last]) ** 2;
  const at = (column: number[] | undefined) => column![last] * k2;
  const [h4, h3, a4, a3] = [at(aero.H4), at(aero.H3), at(aero.A4), at(aero.A3)];
  const b = study.deck.width;
  const { mass: m, inertia: inertia } = study.structure;
  const wh = 2 * Math.PI * study.structure.modes[0].frequency;
  const wa = 2 * Math.PI * study.structure.modes[1].frequency;
  const det = (u: number) => {
    const q = 0.5 * study.air.density * u * u;
    return (m * wh * wh - q * h4) * (inertia * wa * wa - q * b * b * a3) - q * b * h3 * (q * b * a4);
  };
  expect(Math.sign(det(lo))).not.toBe(Math.sign(det(hi)));
  for (let i = 0; i < 200 && hi - lo > 1e-10; i++) {
    const mid = (lo + hi) / 2;
    if (Math.sign(det(mid)) === Math.sign(det(lo))) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe("static instability warning", () => {
  it("reports the one physical crossing of deck B r3, at the zero of the static stiffness determinant", () => {
    const result = runSweep(deckB);
    const crossings = result.warnings.filter((w) => w.code === "static-instability");
    expect(crossings).toHaveLength(1);
    expect(crossings[0].speeds).toHaveLength(1);
    const expected = staticRoot(deckB, 80, 110);
    expect(Math.abs(crossings[0].speeds![0] - expected), `${crossings[0].speeds![0]} vs ${expected}`).toBeLessThan(1e-3);
    expect(crossings[0].message).toContain("mode VS1");
    expect(crossings[0].message).toContain("closed-form divergence");
    // the closed form (A3* only) is lower; it is reported as the divergence speed, not as a second crossing
    expect(result.divergence!.speed).toBeLessThan(expected);
  });

  it("names every branch's crossing in one warning, lowest first", () => {
    const step = (speedMps: number): TrackedStep => ({
      speedMps, re: 0, im: 0, vecRe: new Float64Array(2), vecIm: new Float64Array(2), reducedFrequency: 0.001,
      mac: 1, confidence: 1, converged: true, extrapolated: false,
    });
    const track: TrackResult = { branches: [[], []], ambiguousSpeeds: [], noConvergenceSpeeds: [] };
    const crossings: CriticalPoint[] = [
      { branch: 1, speedMps: 91.25, step: step(91.25), atStart: false },
      { branch: 0, speedMps: 104.5, step: step(104.5), atStart: false },
    ];
    const warnings = collectSweepWarnings({ track, ids: ["VS1", "TS1"], flutter: null, staticCrossings: crossings, quasiSteady: false });
    const statics = warnings.filter((w) => w.code === "static-instability");
    expect(statics).toHaveLength(1);
    expect(statics[0].speeds).toEqual([91.25, 104.5]);
    expect(statics[0].message).toMatch(/91\.25 m\/s on the branch that started as mode TS1.*104\.5 m\/s on the branch that started as mode VS1/);
  });
});
