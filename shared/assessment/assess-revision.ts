/**
 * The one assessment of a study revision (docs/study-format.md §Assessment): computed once from what the revision
 * stores, kept append-only beside it, and read by every screen, the signed summary and its PDF.
 */
import { evaluateCriteria, type EvaluatedCriteria } from "../criteria/evaluate-criteria";
import { computeMargins, type CriticalSpeed, type Margin } from "../criteria/margins";
import { screenStudy } from "../criteria/screen-study";
import { screeningCriticals } from "../criteria/screening-criticals";
import { ASSESSMENT_FORMAT, type Assessment, type StabilityMargin } from "../schemas/assessment";
import { PHENOMENA, type ProjectCriteria } from "../schemas/criteria";
import type { SweepResult } from "../schemas/result";
import type { StudyDocument } from "../schemas/study";
import { SUMMARY_CAUTIONS } from "../schemas/summary";
import { assessDivergence } from "./assess-divergence";
import { assessFlutter, tableRange } from "./assess-flutter";
import { assessWarnings } from "./assess-warnings";
import { assessVortexShedding } from "./assess-vortex-shedding";
import { speedText, urText } from "./format";

/**
 * Version of the assessment's rules and wording. Raise it when they change: stored assessments stay as they are
 * (a signed summary keeps the one it signed), and the next reader of a revision gets a new one.
 */
export const ASSESSOR_VERSION = "1";

/**
 * What an assessment is computed from. Results stored for a revision besides its sweep (an angle-of-attack envelope,
 * amplitudes, a sensitivity study) join as further optional members, each listed in `computedFrom.results`, so that
 * a new result gives a new assessment.
 */
export interface AssessmentInput {
  /** The revision's study document. */
  readonly document: StudyDocument;
  /** Its stored sweep result (thinned branches are fine: only the critical points and warnings are read). */
  readonly result: SweepResult;
  /** The version of the project's criteria to assess against; null while the project has none. */
  readonly criteria: { readonly version: number; readonly criteria: ProjectCriteria } | null;
}

function lastSolved(document: StudyDocument, result: SweepResult): number {
  let highest = -Infinity;
  for (const mode of result.modes) for (const step of mode.steps) highest = Math.max(highest, step.speed);
  return Number.isFinite(highest) ? highest : document.sweep.to;
}

function aerodynamicsStatement(document: StudyDocument): string {
  const aero = document.aerodynamics;
  if (aero.model === "flat-plate") {
    return "Thin-plate theory (Theodorsen): can be unconservative for bluff decks; flutter derivatives must come from tests on the actual deck.";
  }
  if (aero.model === "quasi-steady") {
    return "Quasi-steady theory from static slopes: no aerodynamic torsional damping (A2* = 0), so a flutter speed from it can be far too low.";
  }
  const [lo, hi] = tableRange(document)!;
  return `Flutter derivatives tabulated at Ur ${urText(lo)}–${urText(hi)} (${aero.interpolation} interpolation); outside that range they are held at the table's end values.`;
}

function evaluate(criteria: AssessmentInput["criteria"]): { evaluated: EvaluatedCriteria | null; note: string | null } {
  if (!criteria) return { evaluated: null, note: "The project has no design wind and criteria yet: no required speeds, so no margins." };
  try {
    return { evaluated: evaluateCriteria(criteria.criteria), note: null };
  } catch (err) {
    if (err instanceof RangeError) return { evaluated: null, note: `The project's criteria cannot be evaluated: ${err.message}` };
    throw err;
  }
}

function stability(margin: Margin): StabilityMargin {
  if (margin.status === "investigate" || margin.status === "clear") throw new Error(`a stability check cannot be "${margin.status}"`);
  return { ...margin, status: margin.status };
}

/**
 * Assesses a revision: critical speeds with their basis, the statements about the data behind each, margins and
 * verdicts against a version of the project's criteria, the vortex-shedding screening, and the warnings in words.
 *
 * **Method**: flutter from the sweep (`assessFlutter`: with the critical pole's tested range), divergence by both
 * bases (`assessDivergence`: closed form of EN 1991-1-4 E.4.3 and the sweep's static instability; the margin on the
 * lower), galloping and vortex-shedding onsets from `screenStudy` (EN 1991-1-4 Annex E), margins by `computeMargins`.
 * No critical speed is computed here that the engine did not report — except, for results stored before engine
 * 1.1.0, the closed-form divergence beyond the sweep, by the engine's own routine.
 *
 * **Notes**: pure and deterministic. Results are indicative; critical cases need wind-tunnel verification and review
 * by a licensed engineer under local codes and standards.
 *
 * @param input - the revision's document and sweep result, and the criteria version
 * @returns the assessment (`stillspan.assessment/1`)
 */
export function assessRevision(input: AssessmentInput): Assessment {
  const { document, result, criteria } = input;
  const upTo = lastSolved(document, result);
  const flutter = assessFlutter(document, result, upTo);
  const divergence = assessDivergence(document, result, upTo);
  const { evaluated, note } = evaluate(criteria);
  let screening: ReturnType<typeof screenStudy> | null = null;
  let screeningNote: string | null = null;
  if (document.air.density > 0) {
    try {
      screening = screenStudy(document, evaluated ? criteria!.criteria : undefined);
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      screeningNote = `the screening could not be run: ${err.message}`;
    }
  } else {
    screeningNote = "air density 0 (still-air check): no wind loads to screen";
  }
  const onsets = screening ? screeningCriticals(screening) : null;

  let margins: Assessment["margins"] = null;
  let vortexMargin: Margin | null = null;
  if (evaluated) {
    const critical: Record<(typeof PHENOMENA)[number], CriticalSpeed | null> = {
      flutter: flutter.found ? { kind: "speed", speedMps: flutter.speedMps } : { kind: "above", speedMps: flutter.upToMps },
      divergence:
        divergence.governingSpeedMps !== null
          ? { kind: "speed", speedMps: divergence.governingSpeedMps }
          : { kind: "none", reason: divergence.marginBasis },
      vortexOnset: onsets?.vortexOnset ?? null,
      gallopingOnset: onsets?.gallopingOnset ?? (screeningNote ? { kind: "not-evaluated", reason: `${screeningNote}.` } : null),
    };
    const notes = {
      ...onsets?.notes,
      ...(divergence.governingSpeedMps !== null ? { divergence: divergence.marginBasis } : {}),
      ...(flutter.found && flutter.testedRange.status === "beyond" ? { flutter: `The flutter speed lies ${flutter.testedRange.statement}.` } : {}),
    };
    const all = computeMargins(critical, evaluated.required, notes);
    margins = { flutter: stability(all.flutter), divergence: stability(all.divergence), gallopingOnset: stability(all.gallopingOnset) };
    vortexMargin = all.vortexOnset;
  }
  const statuses = margins ? Object.values(margins).map((m) => m.status) : [];
  const { warnings, warningCount } = assessWarnings(result);

  return {
    format: ASSESSMENT_FORMAT,
    computedFrom: {
      assessor: ASSESSOR_VERSION,
      criteriaVersion: criteria?.version ?? null,
      results: [{ kind: "sweep", engineVersion: result.engine }],
    },
    sweep: { fromMps: document.sweep.from, toMps: document.sweep.to, stepMps: document.sweep.step, lastSolvedMps: upTo },
    aerodynamics: { model: document.aerodynamics.model, testedReducedVelocity: tableRange(document), statement: aerodynamicsStatement(document) },
    flutter,
    divergence,
    selberg: {
      speedMps: result.selberg,
      statement:
        result.selberg !== null
          ? `Selberg's empirical estimate for thin-plate-like decks: ${speedText(result.selberg)} — for orientation only, no margin uses it.`
          : "Selberg's estimate does not apply (it needs f_α > f_h).",
    },
    designWind: evaluated
      ? {
          meanSpeedMps: evaluated.designWind.meanSpeedMps,
          basicSpeedMps: evaluated.designWind.basicSpeedMps,
          deckHeightM: evaluated.designWind.deckHeightM,
          sources: evaluated.designWind.sources,
        }
      : null,
    required: evaluated ? PHENOMENA.map((phenomenon) => ({ phenomenon, ...evaluated.required[phenomenon] })) : null,
    criteriaNote: note,
    margins,
    vortexShedding: assessVortexShedding(screening, vortexMargin, evaluated, screeningNote),
    verdict: !margins ? "no-criteria" : statuses.includes("fail") ? "fail" : statuses.includes("undetermined") ? "undetermined" : "pass",
    warnings,
    warningCount,
    cautions: [...SUMMARY_CAUTIONS],
  };
}
