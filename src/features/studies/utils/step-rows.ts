import type { SweepResult } from "@shared/schemas/result";

export interface StepRow {
  mode: string;
  speed: number;
  frequency: number;
  damping: number;
  re: number;
  im: number;
  mac: number;
  confidence: number;
  participation: Record<string, number>;
}

/** The steps a result carries, every branch, as flat rows ordered by speed and then by branch. */
export function stepRows(result: SweepResult): StepRow[] {
  const rows: StepRow[] = [];
  for (const mode of result.modes) for (const step of mode.steps) rows.push({ mode: mode.id, ...step });
  return rows.sort((a, b) => a.speed - b.speed || a.mode.localeCompare(b.mode));
}
