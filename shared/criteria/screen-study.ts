import type { ProjectCriteriaInput, ScreeningOptions, ScreeningStudy } from "../schemas/criteria";
import { logDecrementFromDampingRatio } from "./check-input";
import { denHartogGalloping, type DenHartogResult } from "./den-hartog-galloping";
import { divergenceSpeed } from "./divergence-speed";
import { evaluateCriteria, type EvaluatedCriteria } from "./evaluate-criteria";
import { gallopingFactorForRectangle } from "./galloping-factor-for-rectangle";
import { gallopingOnsetSpeed } from "./galloping-onset-speed";
import { computeMargins, type CriticalSpeed, type Margins } from "./margins";
import { scrutonNumber } from "./scruton-number";
import { CAUTIONS, SOURCES } from "./sources";
import { staticMomentSlope } from "./static-moment-slope";
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

export interface ScreeningResult {
  designWind: EvaluatedCriteria["designWind"] | null;
  required: EvaluatedCriteria["required"] | null;
  vortexShedding: {
    strouhal: { value: number | null; origin: "input" | "table"; source: string; note: string | null };
    modes: VortexModeCheck[];
    assumptions: string[];
    sources: string[];
  };
  galloping: {
    modeId: string;
    scruton: number;
    standard: { factor: number; factorOrigin: "input" | "table" | "fallback"; factorSource: string; onsetSpeedMps: number };
    denHartog: (DenHartogResult & { coefficientsOrigin: string }) | null;
    /** What the margin uses: the standard's formula or Den Hartog's quasi-steady check. */
    governing: "standard" | "den-hartog";
    critical: CriticalSpeed;
    assumptions: string[];
    sources: string[];
  };
  divergence: {
    speedMps: number | null;
    momentSlope: { value: number; origin: string } | null;
    torsionalStiffnessNmPerM: number;
    critical: CriticalSpeed | null;
    assumptions: string[];
    sources: string[];
  };
  /** Margins of the screening speeds against the project's required speeds (flutter is the engine's). */
  margins: Margins | null;
  cautions: readonly string[];
}

const f2 = (value: number) => value.toFixed(2);

/**
 * Screening of one deck study for vortex shedding, galloping and torsional divergence.
 *
 * **Method**: per mode v_crit = D n / St and Sc (translational 2δm/(ρD²), torsional 2δI/(ρB⁴)); heave-mode
 * galloping by v_CG = 2 Sc n D / a_G and, with static coefficients, Den Hartog's criterion; divergence by
 * v_div = √(2 I ω_α² / (ρ B² dC_M/dα)). Each onset is compared with the project's required speed.
 *
 * **Notes**: EN 1991-1-4:2005 Annex E (E.1.3.1, E.1.3.3, E.2.2, E.4.3) and Den Hartog; each check lists its
 * assumptions and sources, and the result carries the cautions. Results are indicative. Needs ρ > 0.
 *
 * @param study - deck (B, D in m), structure (m kg/m, I kg·m²/m, modes in Hz), air (kg/m³), aerodynamics
 * @param criteria - the project's criteria (optional: without them no required speeds or margins)
 * @param options - measured St, a_G or static coefficients
 * @returns the screening result
 */
export function screenStudy(
  study: ScreeningStudy,
  criteria?: ProjectCriteriaInput,
  options: ScreeningOptions = {},
): ScreeningResult {
  const rho = study.air.density;
  if (!(rho > 0)) throw new RangeError(`air density must be greater than 0 kg/m³ for screening (got ${rho})`);
  const { width: B, depth: D } = study.deck;
  const { mass, inertia, modes } = study.structure;
  const evaluated = criteria ? evaluateCriteria(criteria) : null;
  const required = evaluated?.required ?? null;

  // Vortex shedding.
  const table = strouhalForRectangle(B / D);
  const strouhal =
    options.strouhalNumber !== undefined
      ? { value: options.strouhalNumber, origin: "input" as const, source: options.strouhalBasis ?? "Strouhal number given with the request", note: null }
      : { ...table, origin: "table" as const };
  const vortexRequired = required?.vortexOnset.requiredSpeedMps ?? null;
  const vortexModes = modes.map((mode): VortexModeCheck => {
    const logDecrement = logDecrementFromDampingRatio(mode.damping);
    const scruton =
      mode.dof === "heave"
        ? { value: scrutonNumber(logDecrement, mass, rho, D), form: "translational" as const, source: SOURCES.scruton }
        : { value: torsionalScrutonNumber(logDecrement, inertia, rho, B), form: "torsional" as const, source: SOURCES.torsionalScruton };
    const onset = strouhal.value === null ? null : vortexOnsetSpeed(D, mode.frequency, strouhal.value);
    const { lockIn, statement } = lockInStatement(mode.id, onset, vortexRequired, required?.vortexOnset.totalFactor ?? null);
    return {
      modeId: mode.id,
      dof: mode.dof,
      frequencyHz: mode.frequency,
      dampingRatio: mode.damping,
      logDecrement,
      referenceLengthM: D,
      onsetSpeedMps: onset,
      scruton,
      requiredSpeedMps: vortexRequired,
      lockIn,
      statement,
    };
  });
  const onsets = vortexModes.map((check) => check.onsetSpeedMps).filter((v): v is number => v !== null);

  // Galloping of the heave mode.
  const heave = modes.find((mode) => mode.dof === "heave") ?? modes[0];
  const heaveScruton = scrutonNumber(logDecrementFromDampingRatio(heave.damping), mass, rho, D);
  const factorLookup =
    options.gallopingFactor !== undefined
      ? { value: options.gallopingFactor, origin: "input" as const, source: options.gallopingFactorBasis ?? "a_G given with the request", note: null }
      : gallopingFactorForRectangle(B / D);
  const standardOnset = gallopingOnsetSpeed(heaveScruton, heave.frequency, D, factorLookup.value);
  const coefficients = staticCoefficients(study, options);
  const denHartog = coefficients
    ? {
        ...denHartogGalloping(coefficients.liftSlope, coefficients.dragCoefficient, mass, heave.damping, heave.frequency, rho, B),
        coefficientsOrigin: coefficients.origin,
      }
    : null;
  const governing = denHartog && factorLookup.origin !== "input" ? "den-hartog" : "standard";
  const gallopingCritical: CriticalSpeed =
    governing === "den-hartog" && denHartog
      ? denHartog.unstable
        ? { kind: "speed", speedMps: denHartog.onsetSpeedMps as number }
        : { kind: "none", reason: `Den Hartog coefficient dC_L/dα + C_D = ${f2(denHartog.coefficient)} ≥ 0 (no quasi-steady galloping at the coefficients' mean angle).` }
      : { kind: "speed", speedMps: standardOnset };

  // Divergence.
  const torsion = modes.find((mode) => mode.dof === "torsion") ?? null;
  const slope = staticMomentSlope(study.aerodynamics, options.momentSlope);
  const omegaAlpha = torsion ? 2 * Math.PI * torsion.frequency : 0;
  const stiffness = inertia * omegaAlpha * omegaAlpha;
  const vDiv = torsion && slope ? divergenceSpeed(inertia, torsion.frequency, rho, B, slope.value) : null;
  const divergenceCritical: CriticalSpeed | null =
    !torsion || !slope
      ? null
      : vDiv === null
        ? { kind: "none", reason: `static moment slope dC_M/dα = ${f2(slope.value)} per rad ≤ 0.` }
        : { kind: "speed", speedMps: vDiv };

  const margins = required
    ? computeMargins(
        {
          vortexOnset: onsets.length ? { kind: "speed", speedMps: Math.min(...onsets) } : null,
          gallopingOnset: gallopingCritical,
          divergence: divergenceCritical,
        },
        required,
      )
    : null;

  return {
    designWind: evaluated?.designWind ?? null,
    required,
    vortexShedding: {
      strouhal,
      modes: vortexModes,
      assumptions: [
        `Shedding set by the deck depth D = ${D} m for every mode (the cross-wind dimension); St on D.`,
        strouhal.origin === "input"
          ? `Strouhal number ${strouhal.value} as given.`
          : `Strouhal number from the sharp-cornered rectangle table at B/D = ${f2(B / D)} (from memory); a measured value governs.`,
        "Logarithmic decrement δ_s = 2πζ from each mode's damping ratio; equivalent mass = deck mass per unit length (section model).",
        "Torsional modes: inertia form of the Scruton number (common practice, not EN 1991-1-4).",
      ],
      sources: [SOURCES.vortexOnset, table.source, SOURCES.scruton, SOURCES.torsionalScruton, SOURCES.vortexCriterion, SOURCES.logDecrement],
    },
    galloping: {
      modeId: heave.id,
      scruton: heaveScruton,
      standard: { factor: factorLookup.value, factorOrigin: factorLookup.origin, factorSource: factorLookup.source, onsetSpeedMps: standardOnset },
      denHartog,
      governing,
      critical: gallopingCritical,
      assumptions: [
        `Translational (heave) galloping of mode ${heave.id}, wind normal to the deck, cross-wind dimension D = ${D} m.`,
        factorLookup.note ?? `a_G = ${f2(factorLookup.value)} (${factorLookup.origin}).`,
        denHartog
          ? `Den Hartog from static coefficients (${denHartog.coefficientsOrigin}), both on B = ${B} m, at their mean angle only; onset from the quasi-steady heave damping.`
          : "No static coefficients: Den Hartog's criterion not evaluated.",
        governing === "den-hartog"
          ? "The margin uses Den Hartog's quasi-steady onset (static coefficients of this deck)."
          : "The margin uses the standard's formula v_CG = 2 Sc n b / a_G.",
      ],
      sources: [SOURCES.gallopingOnset, SOURCES.gallopingTable, SOURCES.scruton, SOURCES.gallopingCriterion, SOURCES.denHartog],
    },
    divergence: {
      speedMps: vDiv,
      momentSlope: slope,
      torsionalStiffnessNmPerM: stiffness,
      critical: divergenceCritical,
      assumptions: [
        `k_Θ = I ω_α² = ${stiffness.toExponential(4)} N·m/rad per m from I and the torsional frequency; b = B = ${B} m.`,
        slope ? `dC_M/dα = ${slope.value.toFixed(4)} per rad: ${slope.origin}.` : "No static moment slope available: divergence not evaluated.",
        "Compare with the engine's divergence speed and any static-instability warning of the sweep.",
      ],
      sources: [SOURCES.divergence, SOURCES.divergenceCriterion],
    },
    margins,
    cautions: CAUTIONS,
  };
}

function lockInStatement(
  modeId: string,
  onset: number | null,
  requiredSpeed: number | null,
  factor: number | null,
): { lockIn: LockIn; statement: string } {
  if (onset === null) {
    return { lockIn: "not-evaluated", statement: `Mode ${modeId}: no Strouhal number, onset speed not evaluated — enter a measured St.` };
  }
  if (requiredSpeed === null || factor === null) {
    return {
      lockIn: "not-evaluated",
      statement: `Mode ${modeId}: onset ${onset.toFixed(1)} m/s; no project criteria to compare it with (EN 1991-1-4 E.1.2(2) asks v_crit > 1.25 v_m, from memory).`,
    };
  }
  if (onset < requiredSpeed) {
    return {
      lockIn: "possible",
      statement:
        `Mode ${modeId}: onset ${onset.toFixed(1)} m/s is below the required ${requiredSpeed.toFixed(1)} m/s (${factor} × v_m): ` +
        "vortex-induced vibration (lock-in) is possible in the design wind range. By EN 1991-1-4 E.1.2(2), Expr. (E.1) " +
        "(from memory) its effects must then be investigated: response amplitudes (Annex E.1.5) or section-model tests.",
    };
  }
  return {
    lockIn: "not-expected",
    statement:
      `Mode ${modeId}: onset ${onset.toFixed(1)} m/s ≥ required ${requiredSpeed.toFixed(1)} m/s (${factor} × v_m): ` +
      "lock-in not expected in the design wind range; by EN 1991-1-4 E.1.2(2) (from memory) its effects need not be investigated.",
  };
}

function staticCoefficients(
  study: ScreeningStudy,
  options: ScreeningOptions,
): { liftSlope: number; dragCoefficient: number; origin: string } | null {
  if (options.liftSlope !== undefined && options.dragCoefficient !== undefined) {
    return { liftSlope: options.liftSlope, dragCoefficient: options.dragCoefficient, origin: "given with the screening request" };
  }
  if (study.aerodynamics?.model === "quasi-steady") {
    return {
      liftSlope: study.aerodynamics.liftSlope,
      dragCoefficient: study.aerodynamics.dragCoefficient,
      origin: "the study's quasi-steady data set",
    };
  }
  return null;
}
