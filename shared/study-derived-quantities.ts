import type { StudyDocument } from "./schemas/study";

export interface DerivedQuantities {
  /** f_torsion / f_heave, dimensionless; null until both frequencies are valid. */
  frequencyRatio: number | null;
  /** Radius of gyration r = √(I/m), m. */
  radiusOfGyrationM: number | null;
  /** r / B, dimensionless. */
  radiusOverWidth: number | null;
  /** Mass ratio μ = m/(ρB²), dimensionless; null with still air. */
  massRatio: number | null;
  /** Inertia ratio I/(ρB⁴), dimensionless; null with still air. */
  inertiaRatio: number | null;
}

const positive = (value: unknown): value is number => typeof value === "number" && Number.isFinite(value) && value > 0;

/**
 * The quantities an aerodynamicist checks while typing the structure: frequency ratio f_α/f_h (flutter is
 * coupled and Selberg's estimate applies only above 1), radius of gyration √(I/m), the mass ratio m/(ρB²) and the
 * inertia ratio I/(ρB⁴). Reads a partly filled form (the study form), or a whole document (the signed summary's
 * inputs), so every input may be missing or invalid: each quantity is null until its inputs are valid.
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
    inertiaRatio: positive(inertia) && positive(width) && positive(density) ? inertia / (density * width ** 4) : null,
  };
}

export type DeepPartial<T> = T extends readonly (infer U)[]
  ? Array<DeepPartial<U> | undefined>
  : T extends object
    ? { [K in keyof T]?: DeepPartial<T[K]> }
    : T;
