import type { SweepWarning, SweepWarningCode } from "@shared/schemas/result";
import { WARNING_EXPLANATIONS, WARNING_TITLES } from "@shared/warning-text";

export { WARNING_TITLES };

export function explainWarning(code: SweepWarningCode): string {
  return WARNING_EXPLANATIONS[code];
}

const fmt = (speed: number) => speed.toFixed(1);

/** The speeds a warning concerns, as a short phrase ("12.0–31.5 m/s", "at 4 speeds: 10.0, 10.5, …"). */
export function warningSpeeds(warning: SweepWarning): string | null {
  const speeds = warning.speeds;
  if (!speeds || speeds.length === 0) return null;
  if (warning.code === "extrapolated-derivatives" && speeds.length === 2) {
    return `${fmt(speeds[0])}–${fmt(speeds[1])} m/s`;
  }
  if (speeds.length === 1) return `at ${fmt(speeds[0])} m/s`;
  const shown = speeds.slice(0, 6).map(fmt).join(", ");
  return `at ${speeds.length} speeds: ${shown}${speeds.length > 6 ? ", …" : ""} m/s`;
}
