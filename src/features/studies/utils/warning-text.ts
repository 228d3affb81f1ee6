import type { SweepWarning, SweepWarningCode } from "@shared/schemas/result";

/** One plain sentence per engine warning code: what it means for the number on the screen. */
const EXPLANATIONS: Record<SweepWarningCode, string> = {
  "extrapolated-derivatives":
    "Here the reduced velocity lies outside the tested range: the derivatives were held at the table's end values, so results at these speeds are extrapolated and unreliable.",
  "quasi-steady-flutter":
    "Quasi-steady aerodynamics give no torsional aerodynamic damping, so this flutter speed is likely far too low; use measured derivatives.",
  "unstable-at-start":
    "A pole is already undamped at the first speed, so the true critical speed lies at or below the start of the sweep; start lower.",
  "static-instability":
    "A real pole crosses zero: the deck loses its static stiffness (divergence-type instability) within the sweep, and above that speed it is statically unstable.",
  "tracking-ambiguous":
    "Two poles came so close that the tracker could not tell them apart even at its smallest step; check the branches near these speeds.",
  "no-convergence":
    "The frequency iteration did not settle at these speeds, so the poles there are less accurate.",
};

export const WARNING_TITLES: Record<SweepWarningCode, string> = {
  "extrapolated-derivatives": "Outside the tested range",
  "quasi-steady-flutter": "Flutter from quasi-steady data",
  "unstable-at-start": "Unstable at the first speed",
  "static-instability": "Static instability",
  "tracking-ambiguous": "Pole tracking ambiguous",
  "no-convergence": "Iteration not converged",
};

export function explainWarning(code: SweepWarningCode): string {
  return EXPLANATIONS[code];
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
