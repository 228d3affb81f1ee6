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

/** Every tracked step of every branch as flat rows, ordered by speed and then by branch. */
export function stepRows(result: SweepResult): StepRow[] {
  const rows: StepRow[] = [];
  for (const mode of result.modes) for (const step of mode.steps) rows.push({ mode: mode.id, ...step });
  return rows.sort((a, b) => a.speed - b.speed || a.mode.localeCompare(b.mode));
}

/**
 * The steps as CSV (RFC 4180, comma, dot decimals, SI units in the header) — what a spreadsheet or a script
 * reads without guessing.
 */
export function stepsCsv(result: SweepResult): string {
  const ids = result.modes.map((m) => m.id);
  const header = [
    "branch",
    "speed_m_s",
    "frequency_hz",
    "damping_ratio",
    "re_rad_s",
    "im_rad_s",
    ...ids.map((id) => `participation_${id}`),
    "mac",
    "confidence",
  ];
  const lines = [header.join(",")];
  for (const row of stepRows(result)) {
    lines.push(
      [
        quote(row.mode),
        row.speed,
        row.frequency,
        row.damping,
        row.re,
        row.im,
        ...ids.map((id) => row.participation[id] ?? 0),
        row.mac,
        row.confidence,
      ].join(","),
    );
  }
  return `${lines.join("\r\n")}\r\n`;
}

function quote(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Offers text as a file download (the browser's own save dialog). */
export function downloadText(fileName: string, text: string, type = "text/csv"): void {
  const url = URL.createObjectURL(new Blob([text], { type: `${type};charset=utf-8` }));
  const link = document.createElement("a");
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
