import type { ScreeningOptions, ScreeningStudy } from "../schemas/criteria";
import { logDecrementFromDampingRatio } from "./check-input";
import { denHartogGalloping, type DenHartogResult } from "./den-hartog-galloping";
import { GALLOPING_RECTANGLE_POINTS, gallopingFactorForRectangle } from "./galloping-factor-for-rectangle";
import { gallopingOnsetSpeed } from "./galloping-onset-speed";
import type { CriticalSpeed } from "./margins";
import { scrutonNumber } from "./scruton-number";
import { SOURCES } from "./sources";

export interface GallopingScreening {
  modeId: string;
  scruton: number;
  /** The standard's formula, when a_G is known: given with its source, or inside the table's range; else null. */
  standard: { factor: number; factorOrigin: "input" | "table"; factorSource: string; onsetSpeedMps: number } | null;
  denHartog: (DenHartogResult & { coefficientsOrigin: string }) | null;
  /** What the margin uses: the standard's formula, Den Hartog's quasi-steady check, or nothing (not evaluated). */
  governing: "standard" | "den-hartog" | null;
  /**
   * When the study's flutter sweep already carries the aerodynamic heave damping (measured or quasi-steady H1*),
   * the sentence that says galloping-type loss of heave damping is covered by the sweep; else null.
   */
  coveredBySweep: string | null;
  critical: CriticalSpeed;
  assumptions: string[];
  sources: string[];
}

const [TABLE_MIN, TABLE_MAX] = [GALLOPING_RECTANGLE_POINTS[0][0], GALLOPING_RECTANGLE_POINTS[GALLOPING_RECTANGLE_POINTS.length - 1][0]];

/**
 * Galloping screening of the deck's heave mode.
 *
 * **Method**: v_CG = 2 Sc n D / a_G with Sc = 2δm/(ρD²); with static coefficients also Den Hartog's criterion
 * dC_L/dα + C_D < 0 and its quasi-steady onset 4mζω/(−ρB(C_L′ + C_D)). An a_G given with its source makes the
 * standard's formula govern; otherwise static coefficients do; otherwise the rectangle table, inside its range
 * only. Outside it (bridge decks, B/D ≫ 1) no factor is assumed: galloping is not evaluated, with the reason.
 *
 * **Notes**: EN 1991-1-4:2005 E.2.2 (E.18) (recalled), Table E.7 (from memory); Den Hartog, *Mechanical
 * Vibrations*. Translational galloping only. A sweep with measured or quasi-steady H1* already contains the
 * heave damping whose loss is galloping; that is said, not double-counted. Needs ρ > 0.
 *
 * @param study - deck B, D (m), mass (kg/m), modes, air density (kg/m³), aerodynamics
 * @param options - a_G (with its source) and static coefficients, when known
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
      ? { value: options.gallopingFactor, origin: "input" as const, source: options.gallopingFactorBasis ?? "a_G given with the request" }
      : gallopingFactorForRectangle(B / D);
  const standard = factor
    ? { factor: factor.value, factorOrigin: factor.origin, factorSource: factor.source, onsetSpeedMps: gallopingOnsetSpeed(scruton, heave.frequency, D, factor.value) }
    : null;

  const coefficients = staticCoefficients(study, options);
  const denHartog = coefficients
    ? {
        ...denHartogGalloping(coefficients.liftSlope, coefficients.dragCoefficient, mass, heave.damping, heave.frequency, rho, B),
        coefficientsOrigin: coefficients.origin,
      }
    : null;
  const governing = standard?.factorOrigin === "input" ? "standard" : denHartog ? "den-hartog" : standard ? "standard" : null;
  const ratio = (B / D).toFixed(2);
  const critical: CriticalSpeed =
    governing === "den-hartog" && denHartog
      ? denHartog.unstable
        ? { kind: "speed", speedMps: denHartog.onsetSpeedMps as number }
        : {
            kind: "none",
            reason: `Den Hartog coefficient dC_L/dα + C_D = ${denHartog.coefficient.toFixed(2)} ≥ 0 (no quasi-steady galloping at the coefficients' mean angle).`,
          }
      : standard
        ? { kind: "speed", speedMps: standard.onsetSpeedMps }
        : {
            kind: "not-evaluated",
            reason:
              `B/D = ${ratio} is outside the range of EN 1991-1-4 Table E.7 used here (rectangles, d/b ${TABLE_MIN.toFixed(2)}–${TABLE_MAX}, ` +
              "from memory): give a_G with its source, or a static-coefficient data set (dC_L/dα, C_D) for Den Hartog's check.",
          };
  const coveredBySweep = sweepCoverage(study);

  return {
    modeId: heave.id,
    scruton,
    standard,
    denHartog,
    governing,
    coveredBySweep,
    critical,
    assumptions: [
      `Translational (heave) galloping of mode ${heave.id}, wind normal to the deck, cross-wind dimension D = ${D} m.`,
      !factor
        ? `No a_G: B/D = ${ratio} is outside the table's rectangles (d/b ${TABLE_MIN.toFixed(2)}–${TABLE_MAX}) and no factor is assumed for a deck section.`
        : factor.origin === "input"
          ? `a_G = ${factor.value} as given: ${factor.source}.`
          : `a_G = ${factor.value.toFixed(2)} from the rectangle table at d/b = ${ratio} (from memory).`,
      denHartog
        ? `Den Hartog from static coefficients (${denHartog.coefficientsOrigin}), both on B = ${B} m, at their mean angle only; onset from the quasi-steady heave damping.`
        : "No static coefficients: Den Hartog's criterion not evaluated.",
      governing === "den-hartog"
        ? "The margin uses Den Hartog's quasi-steady onset (static coefficients of this deck)."
        : governing === "standard"
          ? "The margin uses the standard's formula v_CG = 2 Sc n b / a_G."
          : "The margin reports galloping as not evaluated.",
      ...(coveredBySweep ? [coveredBySweep] : []),
    ],
    sources: [
      SOURCES.gallopingOnset,
      SOURCES.gallopingTable,
      SOURCES.scruton,
      SOURCES.gallopingCriterion,
      SOURCES.denHartog,
      ...(coveredBySweep ? [SOURCES.gallopingBySweep] : []),
    ],
  };
}

/** Whether the sweep's heave derivative H1* carries the aerodynamic heave damping (not thin-plate theory's). */
function sweepCoverage(study: ScreeningStudy): string | null {
  const model = study.aerodynamics?.model;
  if (model === "tabulated") {
    return "Galloping-type loss of heave damping is covered by the flutter sweep through the measured H1* (within its tested reduced velocities).";
  }
  if (model === "quasi-steady") {
    return "Galloping-type loss of heave damping is covered by the flutter sweep: its quasi-steady H1* = −(dC_L/dα + C_D)/K is Den Hartog's condition.";
  }
  return null;
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
