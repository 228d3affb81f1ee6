/**
 * Property: what a sweep reports does not depend on its grid step (docs/method-and-validation.md §3). Random
 * tabulated decks (invented test data: flat-plate-like tables with random factors, an optional A2* bump at one row,
 * frequency ratios 0.7–4, damping 0.05–2 %, sweeps that may start above the critical speed, 2 to 8 rows) are swept at
 * three steps, 1, 0.37 and 0.11 × a base step; the flutter speed must agree to 0.01 %, the flutter mode label must
 * agree (or a run must say tracking-ambiguous), and the static crossings must be the same set.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createAeroModel } from "../aero/create-aero-model";
import { runSweep } from "../run-sweep";
import type { SweepResult } from "../../schemas/result";
import type { StudyDocument } from "../../schemas/study";

const plate = createAeroModel({ model: "flat-plate" });
const factor = fc.double({ min: 0.6, max: 1.4, noNaN: true });

const deckArbitrary = fc
  .record({
    width: fc.double({ min: 15, max: 40, noNaN: true }),
    mass: fc.double({ min: 8000, max: 30000, noNaN: true }),
    radius: fc.double({ min: 0.25, max: 0.45, noNaN: true }),
    heaveHz: fc.double({ min: 0.08, max: 0.3, noNaN: true }),
    ratio: fc.oneof(fc.double({ min: 1.02, max: 1.2, noNaN: true }), fc.double({ min: 0.7, max: 4, noNaN: true })),
    dampingH: fc.double({ min: 0.0005, max: 0.02, noNaN: true }),
    dampingA: fc.double({ min: 0.0005, max: 0.02, noNaN: true }),
    firstUr: fc.double({ min: 1, max: 3, noNaN: true }),
    gaps: fc.array(fc.double({ min: 1, max: 5, noNaN: true }), { minLength: 1, maxLength: 7 }),
    factors: fc.array(factor, { minLength: 7, maxLength: 7 }),
    a2Shift: fc.double({ min: -0.2, max: 0.4, noNaN: true }),
    bump: fc.option(fc.record({ row: fc.nat(7), size: fc.double({ min: 0.2, max: 1, noNaN: true }) })),
    cubic: fc.boolean(),
    from: fc.oneof(fc.double({ min: 0, max: 10, noNaN: true }), fc.double({ min: 20, max: 60, noNaN: true })),
    span: fc.double({ min: 60, max: 150, noNaN: true }),
    baseStep: fc.constantFrom(0.5, 1, 2, 3),
  })
  .map((d): StudyDocument => {
    const ur = [d.firstUr];
    for (const gap of d.gaps) ur.push(ur[ur.length - 1] + gap);
    const table = ur.map((u) => plate.derivatives((2 * Math.PI) / u));
    const [fH1, fH2, fH3, fH4, fA1, fA3, fA4] = d.factors;
    const bumpRow = d.bump ? d.bump.row % ur.length : -1;
    const from = Number(d.from.toFixed(2));
    return {
      format: "stillspan.study/1",
      name: "random tabulated deck (test only)",
      air: { density: 1.225 },
      deck: { width: d.width, depth: 3 },
      structure: {
        mass: d.mass,
        inertia: d.mass * (d.radius * d.width) ** 2,
        modes: [
          { id: "V1", dof: "heave", frequency: d.heaveHz, damping: d.dampingH },
          { id: "T1", dof: "torsion", frequency: d.heaveHz * d.ratio, damping: d.dampingA },
        ],
      },
      aerodynamics: {
        model: "tabulated",
        interpolation: d.cubic ? "monotone-cubic" : "linear",
        reducedVelocity: ur,
        H1: table.map((x) => fH1 * x.H1),
        H2: table.map((x) => fH2 * x.H2),
        H3: table.map((x) => fH3 * x.H3),
        H4: table.map((x) => fH4 * x.H4),
        A1: table.map((x) => fA1 * x.A1),
        A2: table.map((x, i) => x.A2 + (d.a2Shift * ur[i]) / 10 + (i === bumpRow ? d.bump!.size : 0)),
        A3: table.map((x) => fA3 * x.A3),
        A4: table.map((x) => fA4 * x.A4),
      },
      sweep: { from, to: Number((from + d.span).toFixed(2)), step: d.baseStep },
    };
  });

const staticSpeeds = (r: SweepResult) => r.warnings.find((w) => w.code === "static-instability")?.speeds ?? [];
const ambiguous = (r: SweepResult) => r.warnings.some((w) => w.code === "tracking-ambiguous");

describe("step independence over random tabulated decks", () => {
  it("gives the same flutter speed (0.01 %), mode label (or an ambiguity) and static crossings at 1, 0.37 and 0.11 × the step", () => {
    fc.assert(
      fc.property(deckArbitrary, (study) => {
        const [base, ...finer] = [1, 0.37, 0.11].map((k) => runSweep(study, { step: study.sweep.step * k }));
        for (const other of finer) {
          const where = `${JSON.stringify(study)}`;
          if (base.flutter === null) expect(other.flutter, where).toBeNull();
          else {
            expect(other.flutter, where).not.toBeNull();
            expect(Math.abs(other.flutter!.speed - base.flutter.speed) / base.flutter.speed, where).toBeLessThan(1e-4);
            if (!ambiguous(base) && !ambiguous(other)) expect(other.flutter!.mode, where).toBe(base.flutter.mode);
          }
          const a = staticSpeeds(base);
          const b = staticSpeeds(other);
          expect(b.length, where).toBe(a.length);
          a.forEach((u, i) => expect(Math.abs(b[i] - u), where).toBeLessThan(1e-6 * u));
        }
      }),
      { seed: 20261202, numRuns: 30 },
    );
  }, 30_000);
});
