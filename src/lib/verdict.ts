/**
 * Colour and wording by verdict, never by quantity: a flutter speed is written in the failure colour only when its
 * margin fails, in the pass colour when it passes, plainly otherwise. Every screen that states an assessment uses
 * these words and tones.
 */
import type { Assessment } from "@shared/schemas/assessment";

export type Verdict = "pass" | "fail" | "undetermined" | "investigate" | "clear" | "not-evaluated";

export const VERDICT_WORD: Record<Verdict, string> = {
  pass: "pass",
  fail: "fail",
  undetermined: "undetermined — extend the sweep",
  investigate: "investigate",
  clear: "clear",
  "not-evaluated": "not evaluated",
};

export const VERDICT_TEXT_TONE: Record<Verdict, string> = {
  pass: "text-steady-700",
  fail: "text-signal-700",
  undetermined: "text-caution-700",
  investigate: "text-caution-700",
  clear: "text-steady-700",
  "not-evaluated": "text-ink-700",
};

export const VERDICT_CHIP_TONE: Record<Verdict, string> = {
  pass: "bg-steady-100 text-steady-700",
  fail: "bg-signal-600 text-white",
  undetermined: "bg-caution-100 text-caution-700",
  investigate: "bg-caution-100 text-caution-700",
  clear: "bg-steady-100 text-steady-700",
  "not-evaluated": "bg-ink-100 text-ink-700",
};

/** The text tone of the flutter speed: its margin's verdict; plain ink without criteria. */
export function flutterTone(assessment: Assessment): string {
  const status = assessment.margins?.flutter.status;
  return status ? VERDICT_TEXT_TONE[status] : "text-ink-950";
}

const mps = (v: number) => `${v.toFixed(2)} m/s`;

/** The flutter figure in a few words: "54.75 m/s", or "none up to 120.00 m/s". */
export function flutterFigure(assessment: Assessment): string {
  const f = assessment.flutter;
  return f.found ? mps(f.speedMps) : `none up to ${mps(f.upToMps)}`;
}

/** The divergence figure the margin uses, named by its basis: "88.33 m/s (closed form)". */
export function divergenceFigure(assessment: Assessment): string {
  const d = assessment.divergence;
  if (d.governingSpeedMps === null) return "none";
  return `${mps(d.governingSpeedMps)} (${d.governing === "static-instability" ? "static instability" : "closed form"})`;
}

/** "5 warnings", "1 warning", "no warnings". */
export function warningCountText(assessment: Assessment): string {
  const n = assessment.warningCount;
  return n === 0 ? "no warnings" : `${n} warning${n === 1 ? "" : "s"}`;
}
