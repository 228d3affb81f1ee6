import type { ScreeningOptions, ScreeningStudy } from "../schemas/criteria";
import { logDecrementFromDampingRatio } from "./check-input";
import { denHartogGalloping, type DenHartogResult } from "./den-hartog-galloping";
import { gallopingFactorForRectangle } from "./galloping-factor-for-rectangle";
import { gallopingOnsetSpeed } from "./galloping-onset-speed";
import type { CriticalSpeed } from "./margins";
import { scrutonNumber } from "./scruton-number";
import { SOURCES } from "./sources";

export interface GallopingScreening {
  modeId: string;
  scruton: number;
  standard: { factor: number; factorOrigin: "input" | "table" | "fallback"; factorSource: string; onsetSpeedMps: number };
  denHartog: (DenHartogResult & { coefficientsOrigin: string }) | null;
  /** What the margin uses: the standard's formula or Den Hartog's quasi-steady check. */
  governing: "standard" | "den-hartog";
  critical: CriticalSpeed;
  assumptions: string[];
  sources: string[];
}

/**
 * Galloping screening of the deck's heave mode.
 *
 * **Method**: v_CG = 2 Sc n D / a_G with Sc = 2δm/(ρD²); with static coefficients also Den Hartog's criterion
 * dC_L/dα + C_D < 0 and its quasi-steady onset 4mζω/(−ρB(C_L′ + C_D)). A given a_G makes the standard's formula
 * govern; otherwise static coefficients do; otherwise the rectangle table / fallback a_G.
 *
 * **Notes**: EN 1991-1-4:2005 E.2.2 (E.18) (recalled), Table E.7 (from memory); Den Hartog, *Mechanical
 * Vibrations*. Translational galloping only. Needs ρ > 0.
 *
 * @param study - deck B, D (m), mass (kg/m), modes, air density (kg/m³), aerodynamics
 * @param options - a_G and static coefficients, when known
 * @returns onset speeds, the governing check and its critical speed, with assumptions and sources
 */
export function screenGalloping(
  study: ScreeningStudy,
  options: Pick<ScreeningOptions, "gallopingFactor" | "gallopingFactorBasis" | "liftSlope" | "dragCoefficient"> = {},
): GallopingScreening {
  const rho = study.air.density;
  const { width: B, depth: D } = study.deck;
  const mass = study.structure.mass;
  const heave = study.structure.modes.find((mode) => mode.dof === "heave") ?? study.structure.modes[0];
  const scruton = scrutonNumber(logDecrementFromDampingRatio(heave.damping), mass, rho, D);
  const factor =
    options.gallopingFactor !== undefined
      ? { value: options.gallopingFactor, origin: "input" as const, source: options.gallopingFactorBasis ?? "a_G given with the request", note: null }
      : gallopingFactorForRectangle(B / D);
  const standardOnset = gallopingOnsetSpeed(scruton, heave.frequency, D, factor.value);

  const coefficients = staticCoefficients(study, options);
  const denHartog = coefficients
    ? {
        ...denHartogGalloping(coefficients.liftSlope, coefficients.dragCoefficient, mass, heave.damping, heave.frequency, rho, B),
        coefficientsOrigin: coefficients.origin,
      }
    : null;
  const governing = denHartog && factor.origin !== "input" ? "den-hartog" : "standard";
  const critical: CriticalSpeed =
    governing === "den-hartog" && denHartog
      ? denHartog.unstable
        ? { kind: "speed", speedMps: denHartog.onsetSpeedMps as number }
        : {
            kind: "none",
            reason: `Den Hartog coefficient dC_L/dα + C_D = ${denHartog.coefficient.toFixed(2)} ≥ 0 (no quasi-steady galloping at the coefficients' mean angle).`,
          }
      : { kind: "speed", speedMps: standardOnset };

  return {
    modeId: heave.id,
    scruton,
    standard: { factor: factor.value, factorOrigin: factor.origin, factorSource: factor.source, onsetSpeedMps: standardOnset },
    denHartog,
    governing,
    critical,
    assumptions: [
      `Translational (heave) galloping of mode ${heave.id}, wind normal to the deck, cross-wind dimension D = ${D} m.`,
      factor.note ?? `a_G = ${factor.value.toFixed(2)} (${factor.origin}).`,
      denHartog
        ? `Den Hartog from static coefficients (${denHartog.coefficientsOrigin}), both on B = ${B} m, at their mean angle only; onset from the quasi-steady heave damping.`
        : "No static coefficients: Den Hartog's criterion not evaluated.",
      governing === "den-hartog"
        ? "The margin uses Den Hartog's quasi-steady onset (static coefficients of this deck)."
        : "The margin uses the standard's formula v_CG = 2 Sc n b / a_G.",
    ],
    sources: [SOURCES.gallopingOnset, SOURCES.gallopingTable, SOURCES.scruton, SOURCES.gallopingCriterion, SOURCES.denHartog],
  };
}

function staticCoefficients(
  study: ScreeningStudy,
  options: Pick<ScreeningOptions, "liftSlope" | "dragCoefficient">,
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
