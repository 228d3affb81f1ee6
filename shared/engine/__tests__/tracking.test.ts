import { describe, expect, it } from "vitest";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";

/**
 * A veering pair (test data): f_α/f_h = 1.05, torsional stiffness softened by A3* > 0 so that the torsional
 * frequency falls through the heave frequency, symmetric aerodynamic stiffness coupling (K²H3* = K²A4*) so
 * that the two branches repel and exchange character instead of crossing.
 */
function veeringDeck(step: number): StudyDocument {
  const ur = [1, 2, 4, 6, 8, 10, 12, 15, 20];
  return {
    format: "stillspan.study/1",
    name: "veering pair",
    air: { density: 1.225 },
    deck: { width: 30, depth: 3 },
    structure: {
      mass: 20000,
      inertia: 20000 * 81,
      modes: [
        { id: "V1", dof: "heave", frequency: 0.2, damping: 0.005 },
        { id: "T1", dof: "torsion", frequency: 0.21, damping: 0.005 },
      ],
    },
    aerodynamics: {
      model: "tabulated",
      interpolation: "linear",
      reducedVelocity: ur,
      H1: ur.map((u) => -0.5 * u),
      A2: ur.map((u) => -0.02 * u),
      A3: ur.map((u) => 0.015 * u * u),
      H3: ur.map((u) => -0.015 * u * u),
      A4: ur.map((u) => -0.015 * u * u),
    },
    sweep: { from: 1, to: 70, step },
  };
}

describe("pole tracking through a veering pair (f_α/f_h = 1.05)", () => {
  const coarse = runSweep(veeringDeck(2));
  const fine = runSweep(veeringDeck(0.1));

  it("really veers: the branches exchange character while their frequencies stay apart", () => {
    const [v, t] = coarse.modes;
    expect(v.steps[0].participation.V1).toBeGreaterThan(0.99);
    expect(v.steps.at(-1)!.participation.V1).toBeLessThan(0.2);
    expect(t.steps.at(-1)!.participation.T1).toBeLessThan(0.2);
    const gap = Math.min(...v.steps.map((s, k) => t.steps[k].frequency - s.frequency));
    expect(gap).toBeGreaterThan(0);
  });

  it("keeps each branch's eigenvector continuous: MAC ≥ 0.9 from step to step", () => {
    for (const mode of coarse.modes) {
      mode.steps.slice(1).forEach((s) => expect(s.mac, `${mode.id} at ${s.speed} m/s`).toBeGreaterThanOrEqual(0.9));
    }
  });

  it("does not swap branches: a 2 m/s grid follows the same branches as a 0.1 m/s grid", () => {
    // compared at the 2 m/s grid speeds (the speeds where a branch passes a table row are visited too, on each grid)
    const onGrid = (speed: number) => Math.abs((speed - 1) / 2 - Math.round((speed - 1) / 2)) < 1e-9;
    coarse.modes.forEach((mode, j) => {
      for (const s of mode.steps.filter((step) => onGrid(step.speed))) {
        const ref = fine.modes[j].steps.find((r) => Math.abs(r.speed - s.speed) < 1e-9)!;
        expect(ref, `speed ${s.speed} in the fine grid`).toBeDefined();
        expect(Math.hypot(ref.re - s.re, ref.im - s.im), `${mode.id} at ${s.speed} m/s`).toBeLessThan(1e-7 * Math.hypot(s.re, s.im));
      }
    });
    expect(coarse.warnings.map((w) => w.code)).not.toContain("tracking-ambiguous");
  });
});
