import type { EvaluatedCriteria } from "../criteria/evaluate-criteria";
import type { Margin } from "../criteria/margins";
import type { ScreeningResult } from "../criteria/screen-study";
import type { Assessment } from "../schemas/assessment";
import { speedText } from "./format";

/**
 * The vortex-shedding onset as a screening result, in its own words: lock-in possible in the design wind range (to
 * investigate: amplitudes and accelerations) or not expected — never a stability margin, never a failure.
 *
 * @param screening - the study's screening (null when it could not run)
 * @param margin - the onset against its threshold from `computeMargins` (null without criteria)
 * @param evaluated - the criteria (for the threshold's factor)
 * @param note - why there is no screening, when there is none
 */
export function assessVortexShedding(
  screening: ScreeningResult | null,
  margin: Margin | null,
  evaluated: EvaluatedCriteria | null,
  note: string | null,
): Assessment["vortexShedding"] {
  const modes = screening?.vortexShedding.modes ?? [];
  let lowest: (typeof modes)[number] | null = null;
  for (const m of modes) if (m.onsetSpeedMps !== null && (lowest === null || m.onsetSpeedMps < lowest.onsetSpeedMps!)) lowest = m;
  const threshold = evaluated?.required.vortexOnset ?? null;
  const base = { onsetSpeedMps: lowest?.onsetSpeedMps ?? null, mode: lowest?.modeId ?? null, thresholdSpeedMps: threshold?.requiredSpeedMps ?? null };
  if (!screening || !lowest) {
    return { ...base, status: "not-evaluated", statement: `Vortex shedding: not evaluated — ${note ?? "no Strouhal number for this section"}.` };
  }
  const onset = `Vortex-shedding onset ${speedText(lowest.onsetSpeedMps!)} (mode ${lowest.modeId}, St ${Number(screening.vortexShedding.strouhal.value!.toPrecision(3))})`;
  if (!threshold || !margin) {
    return { ...base, status: "not-evaluated", statement: `${onset}; no project criteria to compare it with.` };
  }
  const limit = `${speedText(threshold.requiredSpeedMps)} (${threshold.totalFactor} × v_m)`;
  if (margin.status === "investigate") {
    return {
      ...base,
      status: "investigate",
      statement:
        `${onset} lies below ${limit}: lock-in is possible within the design wind range — investigate the vortex-induced ` +
        "amplitudes and deck accelerations (EN 1991-1-4 E.1.5, from memory; or section-model tests). A serviceability and " +
        "fatigue question, not a stability limit.",
    };
  }
  return {
    ...base,
    status: "clear",
    statement: `${onset} lies above ${limit}: lock-in is not expected in the design wind range (EN 1991-1-4 E.1.2(2), from memory).`,
  };
}
