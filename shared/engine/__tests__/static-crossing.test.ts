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
import { inventedDeckB } from "./support/invented-deck-b";

const deckB = inventedDeckB();

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
    const warnings = collectSweepWarnings({ track, ids: ["VS1", "TS1"], flutter: null, staticCrossings: crossings, quasiSteady: false, testedRange: null });
    const statics = warnings.filter((w) => w.code === "static-instability");
    expect(statics).toHaveLength(1);
    expect(statics[0].speeds).toEqual([91.25, 104.5]);
    expect(statics[0].message).toMatch(/91\.25 m\/s on the branch that started as mode TS1.*104\.5 m\/s on the branch that started as mode VS1/);
  });
});
