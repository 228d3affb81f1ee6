/**
 * A static branch stays on its own real root (docs/method-and-validation.md §3). The deck is invented test data
 * (quasi-steady): its heave branch's pole pair reaches the real axis near 53 m/s and the larger root crosses zero
 * at once; on a 2 m/s grid from 2.5 m/s the tracker used to slide onto the pair's smaller root (MAC and confidence 1).
 * The reference is computed here from the equations of motion (§1): with quasi-steady data the matrices do not depend
 * on K, so det Q(λ) = det(λ²M + λC + K) is a quartic whose real roots are found independently (ml-matrix EVD of the
 * state matrix, support/state-poles.ts).
 */
import { describe, expect, it } from "vitest";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { statePoles } from "./support/state-poles";

const deck: StudyDocument = {
  format: "stillspan.study/1",
  name: "static branch continuity (test only)",
  air: { density: 1.225 },
  deck: { width: 25.79, depth: 3 },
  structure: {
    mass: 17263,
    inertia: 990186,
    modes: [
      { id: "V1", dof: "heave", frequency: 0.16878, damping: 0.00757 },
      { id: "T1", dof: "torsion", frequency: 0.19315, damping: 0.01408 },
    ],
  },
  aerodynamics: { model: "quasi-steady", liftSlope: -0.2782, dragCoefficient: 0.1341, momentSlope: 1.2635 },
  sweep: { from: 2.5, to: 150, step: 2 },
};

/** Real roots of det(λ²M + λC + K) at speed U, quasi-steady products (K·H1* = −(C_L′+C_D), K²H3* = −C_L′, K·A1* = K²A3* = C_M′). */
function realRoots(u: number): number[] {
  const { mass: m, inertia: inertia, modes } = deck.structure;
  const b = deck.deck.width;
  const aero = deck.aerodynamics as Extract<StudyDocument["aerodynamics"], { model: "quasi-steady" }>;
  const [wh, wa] = modes.map((mode) => 2 * Math.PI * mode.frequency);
  const q = 0.5 * 1.225 * u * u;
  const c = 0.5 * 1.225 * u * b;
  const stiffness = [[m * wh * wh, q * b * aero.liftSlope], [0, inertia * wa * wa - q * b * b * aero.momentSlope]];
  const damping = [
    [2 * m * modes[0].damping * wh + c * (aero.liftSlope + aero.dragCoefficient), 0],
    [-c * b * aero.momentSlope, 2 * inertia * modes[1].damping * wa],
  ];
  return statePoles([m, inertia], stiffness, damping)
    .filter(([, im]) => Math.abs(im) < 1e-12)
    .map(([re]) => re);
}

describe("static branch continuity (real roots)", () => {
  it.each([2, 1, 0.5])("keeps the heave branch on the larger real root of its pair at step %s m/s", (step) => {
    const result = runSweep(deck, { step });
    const statics = result.modes[0].steps.filter((s) => s.im === 0);
    expect(statics.length, "the heave branch becomes static").toBeGreaterThan(10);
    for (const s of statics) {
      const roots = realRoots(s.speed);
      expect(roots.length, `${s.speed} m/s: ${roots}`).toBe(2);
      const larger = Math.max(...roots);
      expect(Math.abs(s.re - larger), `${s.speed} m/s: branch ${s.re}, roots ${roots}`).toBeLessThan(1e-9 * Math.abs(larger) + 1e-12);
    }
  });

  it("reports the crossing at the closed-form divergence √(2Iω_α²/(ρB²C_M′)) at every step", () => {
    // K²H4* = K²A4* = 0: det(K_s − K_ae) = mω_h²(Iω_α² − ½ρU²B²C_M′) (EN 1991-1-4:2005 E.4.3, Expr. (E.24))
    const wa = 2 * Math.PI * 0.19315;
    const closedForm = Math.sqrt((2 * 990186 * wa * wa) / (1.225 * 25.79 ** 2 * 1.2635));
    for (const step of [2, 1, 0.5]) {
      const statics = runSweep(deck, { step }).warnings.filter((w) => w.code === "static-instability");
      expect(statics.map((w) => w.speeds), `step ${step}`).toHaveLength(1);
      expect(Math.abs(statics[0].speeds![0] - closedForm), `step ${step}: ${statics[0].speeds}`).toBeLessThan(1e-6);
      expect(statics[0].message).toContain("mode V1");
    }
  });
});
