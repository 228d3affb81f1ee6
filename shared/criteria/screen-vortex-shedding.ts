import type { ScreeningOptions, ScreeningStudy } from "../schemas/criteria";
import { logDecrementFromDampingRatio } from "./check-input";
import { scrutonNumber } from "./scruton-number";
import { SOURCES } from "./sources";
import { strouhalForRectangle } from "./strouhal-for-rectangle";
import { torsionalScrutonNumber } from "./torsional-scruton-number";
import { vortexOnsetSpeed } from "./vortex-onset-speed";

export type LockIn = "possible" | "not-expected" | "not-evaluated";

export interface VortexModeCheck {
  modeId: string;
  dof: "heave" | "torsion";
  frequencyHz: number;
  dampingRatio: number;
  logDecrement: number;
  /** Cross-wind dimension in v_crit = b n / St (deck depth D for every mode), m. */
  referenceLengthM: number;
  onsetSpeedMps: number | null;
  scruton: { value: number; form: "translational" | "torsional"; source: string };
  requiredSpeedMps: number | null;
  lockIn: LockIn;
  statement: string;
}

export interface VortexSheddingScreening {
  strouhal: { value: number | null; origin: "input" | "table"; source: string; note: string | null };
  modes: VortexModeCheck[];
  assumptions: string[];
  sources: string[];
}

/**
 * Vortex-shedding screening of every mode of a deck study.
 *
 * **Method**: v_crit = D n / St per mode (b = D for heave and torsion alike); Sc = 2δm/(ρD²) for heave,
 * Sc_θ = 2δI/(ρB⁴) for torsion, δ = 2πζ; lock-in "possible" when v_crit is below the required speed.
 *
 * **Notes**: EN 1991-1-4:2005 E.1.3.1, E.1.3.3, criterion E.1.2(2) (from memory); torsional Sc is common
 * practice. St measured when given, else the rectangle table (from memory). Needs ρ > 0.
 *
 * @param study - deck B, D (m), mass (kg/m), inertia (kg·m²/m), modes (Hz, ζ), air density (kg/m³)
 * @param requirement - required vortex onset speed (m/s) and its factor on v_m, or null without criteria
 * @param options - measured Strouhal number and its basis
 * @returns per-mode onsets, Scruton numbers and lock-in statements with assumptions and sources
 */
export function screenVortexShedding(
  study: ScreeningStudy,
  requirement: { requiredSpeedMps: number; totalFactor: number } | null,
  options: Pick<ScreeningOptions, "strouhalNumber" | "strouhalBasis"> = {},
): VortexSheddingScreening {
  const rho = study.air.density;
  const { width: B, depth: D } = study.deck;
  const table = strouhalForRectangle(B / D);
  const strouhal =
    options.strouhalNumber !== undefined
      ? { value: options.strouhalNumber, origin: "input" as const, source: options.strouhalBasis ?? "Strouhal number given with the request", note: null }
      : { ...table, origin: "table" as const };

  const modes = study.structure.modes.map((mode): VortexModeCheck => {
    const logDecrement = logDecrementFromDampingRatio(mode.damping);
    const scruton =
      mode.dof === "heave"
        ? { value: scrutonNumber(logDecrement, study.structure.mass, rho, D), form: "translational" as const, source: SOURCES.scruton }
        : { value: torsionalScrutonNumber(logDecrement, study.structure.inertia, rho, B), form: "torsional" as const, source: SOURCES.torsionalScruton };
    const onset = strouhal.value === null ? null : vortexOnsetSpeed(D, mode.frequency, strouhal.value);
    return {
      modeId: mode.id,
      dof: mode.dof,
      frequencyHz: mode.frequency,
      dampingRatio: mode.damping,
      logDecrement,
      referenceLengthM: D,
      onsetSpeedMps: onset,
      scruton,
      requiredSpeedMps: requirement?.requiredSpeedMps ?? null,
      ...lockInStatement(mode.id, onset, requirement),
    };
  });

  return {
    strouhal,
    modes,
    assumptions: [
      `Shedding set by the deck depth D = ${D} m for every mode (the cross-wind dimension); St on D.`,
      strouhal.origin === "input"
        ? `Strouhal number ${strouhal.value} as given.`
        : `Strouhal number from the sharp-cornered rectangle table at B/D = ${(B / D).toFixed(2)} (from memory); a measured value governs.`,
      "Logarithmic decrement δ_s = 2πζ from each mode's damping ratio; equivalent mass = deck mass per unit length (section model).",
      "Torsional modes: inertia form of the Scruton number (common practice, not EN 1991-1-4).",
    ],
    sources: [SOURCES.vortexOnset, table.source, SOURCES.scruton, SOURCES.torsionalScruton, SOURCES.vortexCriterion, SOURCES.logDecrement],
  };
}

function lockInStatement(
  modeId: string,
  onset: number | null,
  requirement: { requiredSpeedMps: number; totalFactor: number } | null,
): { lockIn: LockIn; statement: string } {
  if (onset === null) {
    return { lockIn: "not-evaluated", statement: `Mode ${modeId}: no Strouhal number, onset speed not evaluated — enter a measured St.` };
  }
  if (requirement === null) {
    return {
      lockIn: "not-evaluated",
      statement: `Mode ${modeId}: onset ${onset.toFixed(1)} m/s; no project criteria to compare it with (EN 1991-1-4 E.1.2(2) asks v_crit > 1.25 v_m, from memory).`,
    };
  }
  const { requiredSpeedMps: required, totalFactor: factor } = requirement;
  if (onset < required) {
    return {
      lockIn: "possible",
      statement:
        `Mode ${modeId}: onset ${onset.toFixed(1)} m/s is below the required ${required.toFixed(1)} m/s (${factor} × v_m): ` +
        "vortex-induced vibration (lock-in) is possible in the design wind range. By EN 1991-1-4 E.1.2(2), Expr. (E.1) " +
        "(from memory) its effects must then be investigated — cross-wind amplitudes and deck accelerations (Annex E.1.5) " +
        "or section-model tests. Lock-in is a serviceability and fatigue question, not a stability failure.",
    };
  }
  return {
    lockIn: "not-expected",
    statement:
      `Mode ${modeId}: onset ${onset.toFixed(1)} m/s ≥ required ${required.toFixed(1)} m/s (${factor} × v_m): ` +
      "lock-in not expected in the design wind range; by EN 1991-1-4 E.1.2(2) (from memory) its effects need not be investigated.",
  };
}
