import type { AssessedWarning } from "../schemas/assessment";
import type { SweepResult, SweepWarning } from "../schemas/result";
import { explainWarningCode, WARNING_TITLES } from "../warning-text";

const fmt = (speed: number) => speed.toFixed(1);

/** The speeds a warning concerns, as a short phrase ("49.0–120.0 m/s", "at 4 speeds: 10.0, 10.5, …"). */
function speedsPhrase(warning: SweepWarning): string | null {
  const speeds = warning.speeds;
  if (!speeds || speeds.length === 0) return null;
  if (warning.code === "extrapolated-derivatives" && speeds.length === 2) return `${fmt(speeds[0])}–${fmt(speeds[1])} m/s`;
  if (speeds.length === 1) return `at ${fmt(speeds[0])} m/s`;
  const count = warning.speedCount ?? speeds.length;
  const shown = speeds.slice(0, 6).map(fmt).join(", ");
  return `at ${count} speeds: ${shown}${count > 6 ? ", …" : ""} m/s`;
}

/**
 * The sweep's warnings in words, one entry per warning (never one per kind): title, the engine's own message, what
 * the code means for the numbers, the speeds concerned and the branch. The count includes warnings a thinned server
 * result left out of a long list (`sampling.omittedWarnings`), so every screen states the same number.
 */
export function assessWarnings(result: SweepResult): { warnings: AssessedWarning[]; warningCount: number } {
  const warnings = result.warnings.map(
    (w): AssessedWarning => ({
      code: w.code,
      title: (WARNING_TITLES as Record<string, string>)[w.code] ?? w.code,
      message: w.message,
      explanation: explainWarningCode(w.code),
      speeds: speedsPhrase(w),
      branch: w.branch ?? null,
    }),
  );
  return { warnings, warningCount: warnings.length + (result.sampling?.omittedWarnings ?? 0) };
}
