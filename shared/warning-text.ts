import type { SweepWarningCode } from "./schemas/result";

/** One plain sentence per engine warning code: what it means for the number on the screen. */
export const WARNING_EXPLANATIONS: Record<SweepWarningCode, string> = {
  "extrapolated-derivatives":
    "On the named branch the reduced velocity lies outside the tested range: its derivatives were held at the table's end values, so that branch's results at these speeds are extrapolated and unreliable. A critical point whose own Ur lies inside the table is not affected.",
  "quasi-steady-flutter":
    "Quasi-steady aerodynamics give no torsional aerodynamic damping, so this flutter speed is likely far too low; use measured derivatives.",
  "unstable-at-start":
    "A pole is already undamped at the first speed, so the true critical speed lies at or below the start of the sweep; start lower.",
  "pk-fold":
    "The critical branch's damping jumps from positive to negative without passing through zero (a fold of the p-k solution), so the flutter point shown is the undamped point of the harmonic flutter determinant next to the jump.",
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
  "pk-fold": "Fold of the p-k solution",
  "static-instability": "Static instability",
  "tracking-ambiguous": "Pole tracking ambiguous",
  "no-convergence": "Iteration not converged",
};

/** The plain sentence for a warning code; null for a code this build does not know (an older or newer summary). */
export function explainWarningCode(code: string): string | null {
  return Object.hasOwn(WARNING_EXPLANATIONS, code) ? WARNING_EXPLANATIONS[code as SweepWarningCode] : null;
}
