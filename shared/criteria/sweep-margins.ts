import type { SweepResult } from "../schemas/result";
import { computeMargins, type CriticalSpeed, type Margins } from "./margins";
import type { RequiredSpeeds } from "./required-speeds";
import type { ScreeningResult } from "./screen-study";
import { screeningCriticals } from "./screening-criticals";

/**
 * Margins of a stored sweep result (and optionally its study's screening) against the project's required speeds:
 * what the workspace, the comparison and the signed summary show.
 *
 * **Method**: flutter from the sweep — its speed, or, when every branch stayed damped, "none up to" the highest
 * swept speed (a lower bound). Divergence from the sweep's closed form when it lies in the swept range, else from
 * the screening's uncapped closed form (EN 1991-1-4 E.24 — the same expression), which also tells "no divergence"
 * (dC_M/dα ≤ 0) apart from "beyond the range". Vortex-shedding onset (the lowest mode's; "investigate" below the
 * required speed, never "fail") and galloping (a speed, "none", or not evaluated with the reason) from the screening.
 *
 * **Notes**: without a screening, an absent divergence is reported as not evaluated rather than guessed.
 *
 * @param result - the sweep result (speeds in m/s)
 * @param required - required speeds from the project's criteria, m/s
 * @param screening - the screening of the same study, if run
 * @returns status and margin per phenomenon
 */
export function sweepMargins(
  result: Pick<SweepResult, "flutter" | "divergence" | "modes">,
  required: RequiredSpeeds,
  screening?: Pick<ScreeningResult, "divergence" | "galloping" | "vortexShedding"> | null,
): Margins {
  let highestSpeed = -Infinity;
  for (const mode of result.modes) for (const step of mode.steps) highestSpeed = Math.max(highestSpeed, step.speed);

  const flutter: CriticalSpeed | null = result.flutter
    ? { kind: "speed", speedMps: result.flutter.speed }
    : Number.isFinite(highestSpeed)
      ? { kind: "above", speedMps: highestSpeed }
      : null;
  const divergence: CriticalSpeed | null = result.divergence
    ? { kind: "speed", speedMps: result.divergence.speed }
    : (screening?.divergence.critical ?? null);

  const onsets = screening ? screeningCriticals(screening) : null;
  return computeMargins(
    {
      flutter,
      divergence,
      vortexOnset: onsets?.vortexOnset ?? null,
      gallopingOnset: onsets?.gallopingOnset ?? null,
    },
    required,
    onsets?.notes ?? {},
  );
}
