import type { Phenomenon } from "../schemas/criteria";
import type { CriticalSpeed } from "./margins";
import type { GallopingScreening } from "./screen-galloping";
import type { VortexSheddingScreening } from "./screen-vortex-shedding";

export interface ScreeningCriticals {
  vortexOnset: CriticalSpeed | null;
  gallopingOnset: CriticalSpeed;
  /** Sentences appended to the margin statements: which mode sheds first; what already covers galloping. */
  notes: Partial<Record<Phenomenon, string>>;
}

/**
 * The onset speeds the margins read from a screening: the lowest vortex-shedding onset over the modes (with its
 * mode named) and the galloping check as the screening decided it (a speed, "none", or not evaluated with the
 * reason), plus the sweep-coverage sentence for galloping when the study's H1* carries the heave damping.
 *
 * @param screening - vortex-shedding and galloping parts of a study's screening
 * @returns critical speeds (m/s) and notes per phenomenon
 */
export function screeningCriticals(screening: {
  vortexShedding: Pick<VortexSheddingScreening, "modes">;
  galloping: Pick<GallopingScreening, "critical" | "coveredBySweep">;
}): ScreeningCriticals {
  let lowest: VortexSheddingScreening["modes"][number] | null = null;
  for (const mode of screening.vortexShedding.modes) {
    if (mode.onsetSpeedMps !== null && (lowest === null || mode.onsetSpeedMps < (lowest.onsetSpeedMps as number))) lowest = mode;
  }
  const notes: Partial<Record<Phenomenon, string>> = {};
  if (lowest && screening.vortexShedding.modes.length > 1) notes.vortexOnset = `Lowest onset: mode ${lowest.modeId} (${lowest.dof}).`;
  if (screening.galloping.coveredBySweep) notes.gallopingOnset = screening.galloping.coveredBySweep;
  return {
    vortexOnset: lowest ? { kind: "speed", speedMps: lowest.onsetSpeedMps as number } : null,
    gallopingOnset: screening.galloping.critical,
    notes,
  };
}
