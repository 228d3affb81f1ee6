import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { runSweep } from "../run-sweep";
import type { StudyDocument } from "../../schemas/study";

// Property tests over randomly drawn thin-plate decks (bounded runs to keep the suite fast).
const deck = fc.record({
  width: fc.double({ min: 15, max: 45, noNaN: true }),
  mass: fc.double({ min: 8000, max: 40000, noNaN: true }),
  radius: fc.double({ min: 0.25, max: 0.45, noNaN: true }), // radius of gyration / B
  heaveHz: fc.double({ min: 0.08, max: 0.3, noNaN: true }),
  ratio: fc.double({ min: 1.6, max: 3.5, noNaN: true }), // f_α / f_h
  damping: fc.double({ min: 0, max: 0.01, noNaN: true }),
});

type Deck = { width: number; mass: number; radius: number; heaveHz: number; ratio: number; damping: number };

function study(d: Deck, sweep = { from: 5, to: 160, step: 2 }): StudyDocument {
  const inertia = d.mass * (d.radius * d.width) ** 2;
  return {
    format: "stillspan.study/1",
    name: "property deck",
    air: { density: 1.225 },
    deck: { width: d.width, depth: 3 },
    structure: {
      mass: d.mass,
      inertia,
      modes: [
        { id: "H", dof: "heave", frequency: d.heaveHz, damping: d.damping },
        { id: "A", dof: "torsion", frequency: d.heaveHz * d.ratio, damping: d.damping },
      ],
    },
    aerodynamics: { model: "flat-plate" },
    sweep,
  };
}

describe("sweep properties", () => {
  it("permuting the input modes only reorders `modes`", () => {
    fc.assert(
      fc.property(deck, (d) => {
        const a = study(d);
        const b = structuredClone(a);
        b.structure.modes.reverse();
        const ra = runSweep(a);
        const rb = runSweep(b);
        expect(rb.modes.map((m) => m.id)).toEqual(["A", "H"]);
        expect(rb.flutter?.mode).toBe(ra.flutter?.mode);
        if (ra.flutter) expect(Math.abs(rb.flutter!.speed - ra.flutter.speed)).toBeLessThan(1e-6);
        else expect(rb.flutter).toBeNull();
        for (const id of ["A", "H"]) {
          const sa = ra.modes.find((m) => m.id === id)!.steps;
          const sb = rb.modes.find((m) => m.id === id)!.steps;
          expect(sb.length).toBe(sa.length);
          sa.forEach((s, k) => {
            expect(Math.abs(sb[k].re - s.re)).toBeLessThan(1e-8 * Math.hypot(s.re, s.im));
            expect(Math.abs(sb[k].im - s.im)).toBeLessThan(1e-8 * Math.hypot(s.re, s.im));
            expect(Math.abs(sb[k].participation[id] - s.participation[id])).toBeLessThan(1e-8);
          });
        }
      }),
      { numRuns: 8 },
    );
  });

  it("with air density 0 keeps every pole at its structural value −ζω ± iω√(1−ζ²)", () => {
    fc.assert(
      fc.property(deck, (d) => {
        const s = study(d, { from: 0, to: 100, step: 5 });
        s.air.density = 0;
        const result = runSweep(s);
        expect(result.flutter).toBeNull();
        result.modes.forEach((mode, j) => {
          const input = s.structure.modes[j];
          const w = 2 * Math.PI * input.frequency;
          for (const step of mode.steps) {
            expect(Math.abs(step.re + input.damping * w)).toBeLessThan(1e-10 * w);
            expect(Math.abs(step.im - w * Math.sqrt(1 - input.damping ** 2))).toBeLessThan(1e-10 * w);
            expect(step.participation[input.id]).toBeCloseTo(1, 12);
          }
        });
      }),
      { numRuns: 8 },
    );
  });

  it("is deterministic: the same study gives the same result", () => {
    fc.assert(
      fc.property(deck, (d) => {
        expect(runSweep(study(d))).toEqual(runSweep(study(d)));
      }),
      { numRuns: 4 },
    );
  });

  it("finds the same flutter speed, within 0.001 m/s, whatever the sweep step", () => {
    fc.assert(
      fc.property(deck, fc.constantFrom(0.5, 1, 2.5, 5), (d, step) => {
        const fine = runSweep(study(d, { from: 5, to: 160, step: 0.25 })).flutter;
        const coarse = runSweep(study(d, { from: 5, to: 160, step })).flutter;
        if (fine === null) expect(coarse).toBeNull();
        else expect(Math.abs(coarse!.speed - fine.speed), `step ${step}: ${coarse?.speed} vs ${fine.speed}`).toBeLessThan(1e-3);
      }),
      { numRuns: 8 },
    );
  });
});
