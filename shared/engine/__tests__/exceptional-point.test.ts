/**
 * Veering next to an exceptional point (docs/method-and-validation.md §3): two branches pass within 1e-4 |λ| of each
 * other near 15.06 m/s, where their eigenvectors become parallel, so MAC cannot say which pole continues which branch.
 * Invented test data, two decks on either side of the exceptional point (their couplings differ by 7e-5 relative):
 * on one side the branches cross, on the other they veer, and the flutter branch is labelled accordingly. The table
 * holds one row pair below Ur = 1, so above ≈ 5.3 m/s every product is held constant and the poles are exactly the
 * eigenvalues of the state matrix of the equations of motion (§1) — the reference below follows them continuously
 * by the square root of their discriminant, D = ((λ₁ − λ₂)/2)², which is smooth through the near-coalescence.
 */
import { describe, expect, it } from "vitest";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";
import { statePoles } from "./support/state-poles";

const P = { b: 31, m: 17160, inertia: 1.778e6, fh: 0.1714, fa: 0.1777, zh: 0.0037, za: 0.0099, h1: -0.28, a2: 0.0117, a3: 0.0294 };
const UR = [0.5, 1];

function deck(coupling: number, step: number): StudyDocument {
  return {
    format: "stillspan.study/1",
    name: "near-exceptional-point veering (test only)",
    air: { density: 1.225 },
    deck: { width: P.b, depth: 3 },
    structure: {
      mass: P.m,
      inertia: P.inertia,
      modes: [
        { id: "V1", dof: "heave", frequency: P.fh, damping: P.zh },
        { id: "T1", dof: "torsion", frequency: P.fa, damping: P.za },
      ],
    },
    aerodynamics: {
      model: "tabulated",
      interpolation: "linear",
      reducedVelocity: UR,
      H1: UR.map((u) => P.h1 * u),
      A2: UR.map((u) => P.a2 * u),
      A3: UR.map((u) => P.a3 * u * u),
      H3: UR.map((u) => -coupling * u * u),
      A4: UR.map((u) => -coupling * u * u),
    },
    sweep: { from: 1, to: 60, step },
  };
}

/** The two upper-half-plane poles at speed U with the products of the table's row Ur = 1 (K = 2π), lower frequency first. */
function poles(coupling: number, u: number): [number, number][] {
  const k = 2 * Math.PI;
  const q = 0.5 * 1.225 * u * u;
  const c = 0.5 * 1.225 * u * P.b;
  const [wh, wa] = [2 * Math.PI * P.fh, 2 * Math.PI * P.fa];
  // K_s − K_ae and C_s − C_ae with K²H3* = K²A4* = −coupling·K², K²A3* = a3·K², K·H1* = h1·K, K·A2* = a2·K at Ur = 1
  const stiffness = [[P.m * wh * wh, q * P.b * coupling * k * k], [q * P.b * coupling * k * k, P.inertia * wa * wa - q * P.b ** 2 * P.a3 * k * k]];
  const damping = [[2 * P.m * P.zh * wh - c * P.h1 * k, 0], [0, 2 * P.inertia * P.za * wa - c * P.b ** 2 * P.a2 * k]];
  return statePoles([P.m, P.inertia], stiffness, damping)
    .filter((p) => p[1] > 0)
    .sort((x, y) => x[1] - y[1]);
}

/**
 * The label continuous following gives to the branch that flutters: D = ((λ₁ − λ₂)/2)² is sampled every 5e-5 m/s
 * through the approach; where Im D changes sign, Re D < 0 means the poles veer (each keeps its side in frequency),
 * Re D > 0 that they cross (√D changes sign). Heave is the lower pole before the approach.
 */
function continuousLabel(coupling: number, flutterSpeed: number): string {
  let closest = { gap: Infinity, u: 0 };
  for (let u = 14; u <= 16; u += 1e-3) {
    const [a, b] = poles(coupling, u);
    const gap = Math.hypot(a[0] - b[0], a[1] - b[1]) / Math.hypot(...b);
    if (gap < closest.gap) closest = { gap, u };
  }
  expect(closest.gap, "closest approach").toBeLessThan(2e-4);
  let crossing: boolean | null = null;
  let previous: number | null = null;
  for (let u = closest.u - 0.05; u <= closest.u + 0.05; u += 5e-5) {
    const [a, b] = poles(coupling, u);
    const dr = (a[0] - b[0]) / 2;
    const di = (a[1] - b[1]) / 2;
    const im = 2 * dr * di;
    if (previous !== null && Math.sign(previous) !== Math.sign(im)) crossing = dr * dr - di * di > 0;
    previous = im;
  }
  expect(crossing, "Im D changes sign once near the approach").not.toBeNull();
  // no second approach up to flutter: the two frequencies stay at least 0.5 % apart
  for (let u = closest.u + 1; u <= flutterSpeed; u += 0.5) {
    const [a, b] = poles(coupling, u);
    expect((b[1] - a[1]) / b[1], `${u} m/s`).toBeGreaterThan(0.005);
  }
  const [low, high] = poles(coupling, flutterSpeed + 0.05);
  expect(Math.max(low[0], high[0])).toBeGreaterThan(0);
  const lowerUnstable = low[0] > high[0];
  // veering: the heave branch stays the lower pole; crossing: it becomes the upper one
  return lowerUnstable === !crossing ? "V1" : "T1";
}

describe.each([
  { side: "crossing side", coupling: 0.014680583, label: "T1" },
  { side: "veering side", coupling: 0.0146815532, label: "V1" },
])("near-exceptional-point veering, $side", ({ coupling, label }) => {
  const results = [1, 0.5, 0.25, 0.1].map((step) => ({ step, result: runSweep(deck(coupling, step)) }));
  const reference = continuousLabel(coupling, results[3].result.flutter!.speed);

  it(`follows the poles continuously to the label ${label} (reference, independent of the tracker)`, () => {
    expect(reference).toBe(label);
  });

  it("labels the flutter branch as continuous following does at every step, or says tracking-ambiguous there", () => {
    const speeds = results.map(({ result }) => result.flutter!.speed);
    for (const { step, result } of results) {
      expect(Math.abs(result.flutter!.speed - speeds[3]) / speeds[3], `step ${step}`).toBeLessThan(1e-4);
      expect(result.flutter!.mode, `step ${step}`).toBe(reference);
      const ambiguous = result.warnings.find((w) => w.code === "tracking-ambiguous");
      // an ambiguity, if any, is at the veering speed
      for (const u of ambiguous?.speeds ?? []) expect(Math.abs(u - 15.06), `step ${step}: ambiguous at ${u}`).toBeLessThan(step);
    }
  });

  it("resolves the veering by continuity, without an ambiguity, at steps of 0.5 m/s and finer", () => {
    for (const { step, result } of results.filter((r) => r.step <= 0.5)) {
      expect(result.warnings.map((w) => w.code), `step ${step}`).not.toContain("tracking-ambiguous");
    }
  });
});
