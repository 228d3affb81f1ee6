import type { UploadIssue } from "../schemas/datasets";
import { quoteValue } from "../message-bounds";
import { capIssues, columnLabel, readCsvTable } from "./read-csv-table";
import { checkHeader, readNumericColumns } from "./read-numeric-columns";

export interface StaticRow {
  angleDeg: number;
  CD: number;
  CL: number;
  CM: number;
}

export type StaticCsvResult =
  | { ok: true; rows: StaticRow[]; warnings: { message: string; column?: string }[] }
  | { ok: false; issues: UploadIssue[] };

const NAMES = ["angleDeg", "CD", "CL", "CM"] as const;

function canonicalName(cell: string): string | null {
  return NAMES.find((n) => n.toLowerCase() === cell.trim().toLowerCase()) ?? null;
}

/**
 * Reads a static-coefficient CSV: header `angleDeg,CD,CL,CM` (all four, any order; names case-insensitive),
 * angle of attack in degrees strictly increasing, coefficients dimensionless.
 *
 * **Notes**: same reporting as the flutter-derivative reader (line and column of each problem); at least 2
 * rows, a warning below 4.
 */
export function readStaticCoefficientsCsv(bytes: Uint8Array): StaticCsvResult {
  const read = readCsvTable(bytes);
  if (!read.ok) return read;
  const { header, rows } = read.table;
  const expected = NAMES.join(",");
  const issues = checkHeader(header, canonicalName, expected);
  const names = header.map((c) => canonicalName(c) ?? c);
  for (const name of NAMES) {
    if (issues.length === 0 && !names.includes(name)) issues.push({ row: 1, column: name, message: `column ${name} is missing; expected ${expected}` });
  }
  if (issues.length === 0 && names[0] !== "angleDeg") {
    issues.push({ row: 1, column: columnLabel(header[0], 0), message: `the first column must be angleDeg; found ${quoteValue(header[0])}` });
  }
  if (issues.length > 0) return { ok: false, issues: capIssues(issues) };
  const columns = readNumericColumns(read.table, names, "angle of attack (angleDeg)");
  if (!columns.ok) return { ok: false, issues: capIssues(columns.issues) };
  if (rows.length < 2) {
    return { ok: false, issues: [{ message: `The file has ${rows.length} data row(s); at least 2 are needed.` }] };
  }
  const get = (n: string) => columns.data.columns.get(n)!;
  const out: StaticRow[] = get("angleDeg").map((angleDeg, i) => ({
    angleDeg,
    CD: get("CD")[i],
    CL: get("CL")[i],
    CM: get("CM")[i],
  }));
  const warnings = rows.length < 4 ? [{ message: `Only ${rows.length} data rows.` }] : [];
  return { ok: true, rows: out, warnings };
}
