import { createAeroModel } from "../../shared/engine/aero/create-aero-model.js";
import { divergenceSpeed } from "../../shared/engine/divergence-speed.js";
import type { SweepResult } from "../../shared/schemas/result.js";
import type { CriticalSpeeds } from "../../shared/schemas/revisions.js";
import type { StudyDocument } from "../../shared/schemas/study.js";

/**
 * The critical speeds of a stored result, kept beside it for lists, comparisons and trends.
 * Divergence is taken from its closed form (the same routine the engine uses) even when it lies beyond the
 * sweep — the engine's result only reports it inside the swept range — so a margin can still be stated.
 */
export function criticalSpeeds(study: StudyDocument, result: SweepResult): CriticalSpeeds {
  const torsion = study.structure.modes.find((m) => m.dof === "torsion")!;
  const slope = createAeroModel(study.aerodynamics).staticMomentSlope;
  const uDiv = divergenceSpeed(study.structure.inertia, torsion.frequency, study.air.density, study.deck.width, slope);
  const steps = result.modes[0]?.steps ?? [];
  return {
    flutter: result.flutter
      ? {
          speedMps: result.flutter.speed,
          frequencyHz: result.flutter.frequency,
          kind: result.flutter.kind,
          mode: result.flutter.mode,
          reducedVelocity: result.flutter.reducedVelocity,
        }
      : null,
    divergenceSpeedMps: uDiv,
    divergenceNote:
      uDiv !== null
        ? null
        : study.air.density === 0
          ? "air density 0 (still-air check)"
          : "the static moment slope dC_M/dα is not positive (or unknown): no torsional divergence",
    selbergSpeedMps: result.selberg,
    sweepToMps: steps.length > 0 ? steps[steps.length - 1].speed : study.sweep.to,
    warningCodes: [...new Set(result.warnings.map((w) => w.code))],
  };
}
