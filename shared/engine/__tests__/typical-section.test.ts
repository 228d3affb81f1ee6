import { describe, expect, it } from "vitest";
import { theodorsen } from "../aero/theodorsen";
import { locateFlutter } from "../core/locate-critical";
import { trackPoles } from "../core/track-poles";
import { sweepGrid } from "../sweep-grid";
import { jonesLift, typicalSection } from "./support/typical-section";

// Lee, Price & Wong (1999), "Nonlinear aeroelastic analysis of airfoils: bifurcation and chaos", Progress in
// Aerospace Sciences 35: μ = 100, a_h = −1/2, x_α = 1/4, r_α = 1/2, ω_h/ω_α = 0.2, no damping.
const CASE = { mu: 100, a: -0.5, xAlpha: 0.25, rAlpha: 0.5, frequencyRatio: 0.2 };

function flutterSpeed(lift: (k: number, out: Float64Array) => void): number {
  const system = typicalSection({ ...CASE, lift });
  const track = trackPoles(system, sweepGrid(1, 10, 0.05));
  const flutter = locateFlutter(system, track);
  expect(flutter, "the typical section must flutter in U/(bω_α) = 1…10").not.toBeNull();
  return flutter!.speedMps;
}

describe("typical section through the n-mode core (test-only adapter, full mass matrix with static unbalance)", () => {
  it("with Jones' approximation of C(k) flutters at U/(bω_α) = 6.2851 (Lee, Price & Wong 1999 — value from memory)", () => {
    const u = flutterSpeed(jonesLift);
    // published 6.2851 (from memory); an independent reference computed 6.28509 with the same approximation
    expect(Math.abs(u - 6.2851) / 6.2851, `U/(bω_α) = ${u}`).toBeLessThan(2e-4);
  });

  it("with the exact Theodorsen function flutters at U/(bω_α) = 6.2566 (computed by an independent reference)", () => {
    const work = new Float64Array(4);
    const u = flutterSpeed((k, out) => theodorsen(k, out, work));
    expect(Math.abs(u - 6.2566) / 6.2566, `U/(bω_α) = ${u}`).toBeLessThan(2e-4);
  });
});
