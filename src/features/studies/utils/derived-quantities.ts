import type { StudyDocument } from "@shared/schemas/study";

export interface DerivedQuantities {
  /** f_torsion / f_heave, dimensionless; null until both frequencies are valid. */
  frequencyRatio: number | null;
  /** Radius of gyration r = √(I/m), m. */
  radiusOfGyrationM: number | null;
  /** r / B, dimensionless. */
  radiusOverWidth: number | null;
  /** Mass ratio μ = m/(ρB²), dimensionless; null with still air. */
  massRatio: number | null;
}

const positive = (value: unknown): value is number => typeof value === "number" && Number.isFinite(value) && value > 0;

/**
 * The quantities an aerodynamicist checks while typing the structure: frequency ratio f_α/f_h (flutter is
 * coupled and Selberg's estimate applies only above 1), radius of gyration √(I/m) and the mass ratio m/(ρB²).
 * Reads a partly filled form, so every input may be missing or invalid: each quantity is null until its inputs
 * are valid.
 */
export function derivedQuantities(values: DeepPartial<StudyDocument>): DerivedQuantities {
  const modes = values.structure?.modes ?? [];
  const heave = modes.find((m) => m?.dof === "heave")?.frequency;
  const torsion = modes.find((m) => m?.dof === "torsion")?.frequency;
  const mass = values.structure?.mass;
  const inertia = values.structure?.inertia;
  const width = values.deck?.width;
  const density = values.air?.density;
  const radius = positive(mass) && positive(inertia) ? Math.sqrt(inertia / mass) : null;
  return {
    frequencyRatio: positive(heave) && positive(torsion) ? torsion / heave : null,
    radiusOfGyrationM: radius,
    radiusOverWidth: radius !== null && positive(width) ? radius / width : null,
    massRatio: positive(mass) && positive(width) && positive(density) ? mass / (density * width * width) : null,
  };
}

export type DeepPartial<T> = T extends readonly (infer U)[]
  ? Array<DeepPartial<U> | undefined>
  : T extends object
    ? { [K in keyof T]?: DeepPartial<T[K]> }
    : T;
