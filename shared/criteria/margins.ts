import { PHENOMENA, type Phenomenon } from "../schemas/criteria";
import type { RequiredSpeeds } from "./required-speeds";

/**
 * What a study found for one phenomenon:
 * - `speed`: the critical speed, m/s;
 * - `above`: none found up to `speedMps` (e.g. the end of the sweep) — the true value is higher;
 * - `none`: the phenomenon cannot occur for this deck (e.g. divergence with dC_M/dα ≤ 0), with the reason.
 */
export type CriticalSpeed =
  | { kind: "speed"; speedMps: number }
  | { kind: "above"; speedMps: number }
  | { kind: "none"; reason: string };

export type MarginStatus = "pass" | "fail" | "undetermined" | "not-evaluated";

export interface Margin {
  status: MarginStatus;
  /** critical / required; a lower bound when `marginIsLowerBound`; null when there is no ratio to show. */
  margin: number | null;
  marginIsLowerBound: boolean;
  criticalSpeedMps: number | null;
  requiredSpeedMps: number;
  /** One sentence the UI and reports show beside the numbers. */
  statement: string;
}

export type Margins = Record<Phenomenon, Margin>;

const LABEL: Record<Phenomenon, string> = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
};

const f1 = (value: number) => value.toFixed(1);
const f2 = (value: number) => value.toFixed(2);

/**
 * Margins of a result against the project's required speeds.
 *
 * **Method**: margin = U_crit / U_req; pass when margin ≥ 1. When no instability was found up to a speed,
 * that speed gives a lower bound: pass if it already reaches U_req, otherwise undetermined (extend the
 * sweep). A phenomenon that cannot occur passes without a ratio; a missing one is "not-evaluated".
 *
 * **Notes**: pure bookkeeping; the critical speeds come from the engine or the screening.
 *
 * @param critical - what the study found per phenomenon (missing or null = not evaluated)
 * @param required - required speeds from {@link requiredSpeeds}, m/s
 * @returns status, margin and a statement per phenomenon
 */
export function computeMargins(
  critical: Partial<Record<Phenomenon, CriticalSpeed | null>>,
  required: RequiredSpeeds,
): Margins {
  const out = {} as Margins;
  for (const phenomenon of PHENOMENA) {
    out[phenomenon] = marginOf(LABEL[phenomenon], critical[phenomenon] ?? null, required[phenomenon].requiredSpeedMps);
  }
  return out;
}

function marginOf(label: string, found: CriticalSpeed | null, requiredSpeedMps: number): Margin {
  const base = { requiredSpeedMps, marginIsLowerBound: false };
  if (found === null) {
    return { ...base, status: "not-evaluated", margin: null, criticalSpeedMps: null, statement: `${label}: not evaluated.` };
  }
  if (found.kind === "none") {
    return { ...base, status: "pass", margin: null, criticalSpeedMps: null, statement: `${label}: not possible — ${found.reason}` };
  }
  const margin = found.speedMps / requiredSpeedMps;
  if (found.kind === "above") {
    const reached = margin >= 1;
    return {
      ...base,
      status: reached ? "pass" : "undetermined",
      margin,
      marginIsLowerBound: true,
      criticalSpeedMps: null,
      statement: reached
        ? `${label}: none found up to ${f1(found.speedMps)} m/s ≥ required ${f1(requiredSpeedMps)} m/s (margin ≥ ${f2(margin)}).`
        : `${label}: none found up to ${f1(found.speedMps)} m/s, below the required ${f1(requiredSpeedMps)} m/s — extend the range.`,
    };
  }
  const pass = margin >= 1;
  return {
    ...base,
    status: pass ? "pass" : "fail",
    margin,
    criticalSpeedMps: found.speedMps,
    statement: `${label}: ${f1(found.speedMps)} m/s ${pass ? "≥" : "<"} required ${f1(requiredSpeedMps)} m/s (margin ${f2(margin)}).`,
  };
}
