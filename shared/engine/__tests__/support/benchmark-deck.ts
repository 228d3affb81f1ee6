import type { StudyDocument } from "../../../schemas/study";

/**
 * Inputs of the IABSE Task Group 3.1 two-degree-of-freedom benchmark deck (Diana et al., Structural Engineering
 * International 30(3), 2020 — journal details from memory; inputs as listed in docs/conventions.md §Benchmark deck), with
 * flat-plate aerodynamics.
 */
export function benchmarkDeck(overrides: {
  density?: number;
  damping?: number;
  massFactor?: number;
  heaveHz?: number;
  step?: number;
  from?: number;
  to?: number;
} = {}): StudyDocument {
  const damping = overrides.damping ?? 0.003;
  const factor = overrides.massFactor ?? 1;
  return {
    format: "stillspan.study/1",
    name: "Benchmark deck (IABSE TG 3.1 inputs), flat plate",
    air: { density: overrides.density ?? 1.22 },
    deck: { width: 31, depth: 3 },
    structure: {
      mass: 22740 * factor,
      inertia: 2.47e6 * factor,
      modes: [
        { id: "V1", dof: "heave", frequency: overrides.heaveHz ?? 0.1, damping },
        { id: "T1", dof: "torsion", frequency: 0.278, damping },
      ],
    },
    aerodynamics: { model: "flat-plate" },
    sweep: { from: overrides.from ?? 1, to: overrides.to ?? 150, step: overrides.step ?? 0.5 },
  };
}

/** Relative difference |a − b| / |b|. */
export function relativeError(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}
