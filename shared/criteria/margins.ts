import { PHENOMENA, type Phenomenon } from "../schemas/criteria";
import type { RequiredSpeeds } from "./required-speeds";

/**
 * What a study found for one phenomenon:
 * - `speed`: the critical (or onset) speed, m/s;
 * - `above`: none found up to `speedMps` (e.g. the end of the sweep) — the true value is higher;
 * - `none`: the phenomenon cannot occur for this deck (e.g. divergence with dC_M/dα ≤ 0), with the reason;
 * - `not-evaluated`: no defensible way to evaluate it with the data at hand, with the reason and what would do.
 */
export type CriticalSpeed =
  | { kind: "speed"; speedMps: number }
  | { kind: "above"; speedMps: number }
  | { kind: "none"; reason: string }
  | { kind: "not-evaluated"; reason: string };

/**
 * Outcome of one check. Stability limits (flutter, divergence, galloping) pass or fail; the vortex-shedding
 * onset is a screening: "investigate" (lock-in possible in the design wind range — amplitudes and accelerations
 * must be checked) or "clear" (no investigation needed). Never "fail" for vortex shedding: lock-in is a
 * serviceability and fatigue question, not a loss of stability.
 */
export type MarginStatus = "pass" | "fail" | "undetermined" | "investigate" | "clear" | "not-evaluated";

/** How a phenomenon's speed is judged: a stability limit, or an onset that triggers further checks. */
export const CHECK_KIND: Record<Phenomenon, "stability" | "onset"> = {
  flutter: "stability",
  divergence: "stability",
  vortexOnset: "onset",
  gallopingOnset: "stability",
};

export interface Margin {
  status: MarginStatus;
  /** critical / required; a lower bound when `marginIsLowerBound`; null when there is no ratio to show. */
  margin: number | null;
  marginIsLowerBound: boolean;
  criticalSpeedMps: number | null;
  requiredSpeedMps: number;
  /** One or two sentences the UI and reports show beside the numbers. */
  statement: string;
}

export type Margins = Record<Phenomenon, Margin>;

const LABEL: Record<Phenomenon, string> = {
  flutter: "Flutter",
  divergence: "Torsional divergence",
  vortexOnset: "Vortex-shedding onset",
  gallopingOnset: "Galloping onset",
};

const f2 = (value: number) => value.toFixed(2);
/** Speeds to 0.01 m/s, as the assessment prints them everywhere (shared/assessment/format.ts). */
const speed = (value: number) => value.toFixed(2);

const VORTEX_INVESTIGATE =
  "lock-in is possible within the design wind range: investigate the vortex-induced amplitudes and deck " +
  "accelerations (EN 1991-1-4 E.1.2(2) and E.1.5, from memory; or section-model tests). Not a stability limit.";
const VORTEX_CLEAR = "no lock-in in the design wind range; by EN 1991-1-4 E.1.2(2) (from memory) its effects need not be investigated.";

/**
 * Margins of a result against the project's required speeds.
 *
 * **Method**: margin = U_crit / U_req. Stability limits (flutter, divergence, galloping) pass when margin ≥ 1 and
 * fail below; "none found up to U" gives a lower bound (pass if U ≥ U_req, else undetermined: extend the sweep);
 * a phenomenon that cannot occur passes without a ratio. The vortex-shedding onset is a screening: below U_req
 * "investigate" (amplitude and acceleration checks needed), at or above it "clear". Missing or not evaluable
 * checks are "not-evaluated", with the reason.
 *
 * **Notes**: pure bookkeeping; the speeds come from the engine or the screening. EN 1991-1-4:2005 E.1.2(2):
 * vortex-shedding effects need not be investigated when v_crit > 1.25 v_m (from memory).
 *
 * @param critical - what the study found per phenomenon (missing or null = not evaluated)
 * @param required - required speeds from {@link requiredSpeeds}, m/s
 * @param notes - an optional sentence per phenomenon appended to its statement (which mode, what covers it)
 * @returns status, margin and a statement per phenomenon
 */
export function computeMargins(
  critical: Partial<Record<Phenomenon, CriticalSpeed | null>>,
  required: RequiredSpeeds,
  notes: Partial<Record<Phenomenon, string>> = {},
): Margins {
  const out = {} as Margins;
  for (const phenomenon of PHENOMENA) {
    const margin = marginOf(phenomenon, critical[phenomenon] ?? null, required[phenomenon].requiredSpeedMps);
    const note = notes[phenomenon];
    out[phenomenon] = note ? { ...margin, statement: `${margin.statement} ${note}` } : margin;
  }
  return out;
}

function marginOf(phenomenon: Phenomenon, found: CriticalSpeed | null, requiredSpeedMps: number): Margin {
  const label = LABEL[phenomenon];
  const onset = CHECK_KIND[phenomenon] === "onset";
  const base = { requiredSpeedMps, marginIsLowerBound: false };
  if (found === null) {
    return { ...base, status: "not-evaluated", margin: null, criticalSpeedMps: null, statement: `${label}: not evaluated.` };
  }
  if (found.kind === "not-evaluated") {
    return { ...base, status: "not-evaluated", margin: null, criticalSpeedMps: null, statement: `${label}: not evaluated — ${found.reason}` };
  }
  if (found.kind === "none") {
    return {
      ...base,
      status: onset ? "clear" : "pass",
      margin: null,
      criticalSpeedMps: null,
      statement: `${label}: not possible — ${found.reason}`,
    };
  }
  const margin = found.speedMps / requiredSpeedMps;
  const reached = margin >= 1;
  if (found.kind === "above") {
    const upTo = `${label}: none found up to ${speed(found.speedMps)} m/s`;
    return {
      ...base,
      status: reached ? (onset ? "clear" : "pass") : onset ? "investigate" : "undetermined",
      margin,
      marginIsLowerBound: true,
      criticalSpeedMps: null,
      statement: reached
        ? `${upTo} ≥ required ${speed(requiredSpeedMps)} m/s (margin ≥ ${f2(margin)}).`
        : onset
          ? `${upTo}, below the required ${speed(requiredSpeedMps)} m/s: ${VORTEX_INVESTIGATE}`
          : `${upTo}, below the required ${speed(requiredSpeedMps)} m/s — extend the range.`,
    };
  }
  const comparison = `${label}: ${speed(found.speedMps)} m/s ${reached ? "≥" : "<"} required ${speed(requiredSpeedMps)} m/s`;
  if (onset) {
    return {
      ...base,
      status: reached ? "clear" : "investigate",
      margin,
      criticalSpeedMps: found.speedMps,
      statement: `${comparison}: ${reached ? VORTEX_CLEAR : VORTEX_INVESTIGATE}`,
    };
  }
  return {
    ...base,
    status: reached ? "pass" : "fail",
    margin,
    criticalSpeedMps: found.speedMps,
    statement: `${comparison} (margin ${f2(margin)}).`,
  };
}
