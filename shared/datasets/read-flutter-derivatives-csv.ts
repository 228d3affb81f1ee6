import type { DerivativeConventionInput, UploadIssue } from "../schemas/datasets";
import { DERIVATIVE_NAMES, type DerivativeName } from "../schemas/study";
import { quoteValue } from "../message-bounds";
import { capIssues, columnLabel, readCsvTable } from "./read-csv-table";
import { checkHeader, readNumericColumns } from "./read-numeric-columns";

/** Flutter derivatives as delivered: the abscissa column and all eight derivatives (missing ones as zeros). */
export type DeliveredTable = { abscissa: number[] } & Record<DerivativeName, number[]>;

export type FlutterCsvResult =
  | { ok: true; delivered: DeliveredTable; warnings: { message: string; column?: string }[] }
  | { ok: false; issues: UploadIssue[] };

/** Header name of the abscissa column for a delivered convention. */
export function abscissaHeader(abscissa: DerivativeConventionInput["abscissa"]): "Ur" | "K" {
  return abscissa === "Ur" || abscissa === "Ur-half" ? "Ur" : "K";
}

/** "h1", "H1*", " A4 " → "H1", "A4"; "ur" → "Ur"; "k" → "K"; anything else → null. */
function canonicalName(cell: string): string | null {
  const plain = cell.replace(/\*$/, "").trim();
  if (/^ur$/i.test(plain)) return "Ur";
  if (/^k$/i.test(plain)) return "K";
  const upper = plain.toUpperCase();
  return (DERIVATIVE_NAMES as readonly string[]).includes(upper) ? upper : null;
}

/**
 * Reads a flutter-derivative CSV: header `Ur,H1,H2,H3,H4,A1,A2,A3,A4` (first column `K` for the K and k-half
 * abscissae), derivative columns in any order, any of them optional (zeros, with a warning).
 *
 * **Notes**: every problem is reported with its line (header = 1) and column: unknown or repeated columns, a
 * first column that is not the abscissa of the declared convention, wrong field counts, values that are not
 * finite numbers, an abscissa that is ≤ 0, repeated or not strictly increasing (K: strictly monotonic in either
 * direction), fewer than 2 rows. Fewer than
 * 4 rows is a warning. The values are returned as delivered; conversion is `convertConvention`.
 */
export function readFlutterDerivativesCsv(
  bytes: Uint8Array,
  abscissa: DerivativeConventionInput["abscissa"],
): FlutterCsvResult {
  const read = readCsvTable(bytes);
  if (!read.ok) return read;
  const { header, rows } = read.table;
  const expectedFirst = abscissaHeader(abscissa);
  const expected = `${expectedFirst},H1,H2,H3,H4,A1,A2,A3,A4`;
  const issues = checkHeader(header, canonicalName, expected);
  const names = header.map((c) => canonicalName(c) ?? c);
  if (issues.length === 0 && names[0] !== expectedFirst) {
    issues.push({
      row: 1,
      column: columnLabel(header[0], 0),
      message: `the first column must be the abscissa "${expectedFirst}" (convention: ${abscissa}); found ${quoteValue(header[0])}`,
    });
  }
  if (issues.length === 0 && names.slice(1).some((n) => n === "Ur" || n === "K")) {
    issues.push({ row: 1, message: "only the first column may be the abscissa (Ur or K)" });
  }
  if (issues.length > 0) return { ok: false, issues: capIssues(issues) };

  const label = expectedFirst === "Ur" ? "reduced velocity (Ur)" : "reduced frequency (K)";
  // A table in K is often sorted by Ur, i.e. by decreasing K: either direction is accepted for K.
  const columns = readNumericColumns(read.table, names, label, expectedFirst === "K" ? "monotonic" : "increasing");
  if (!columns.ok) return { ok: false, issues: capIssues(columns.issues) };
  const x = columns.data.columns.get(expectedFirst)!;
  const nonPositive = x.findIndex((v) => !(v > 0));
  if (nonPositive >= 0) {
    return {
      ok: false,
      issues: [{ row: columns.data.lines[nonPositive], column: columnLabel(header[0], 0), message: `${x[nonPositive]} must be greater than 0` }],
    };
  }
  if (rows.length < 2) {
    return { ok: false, issues: [{ message: `The file has ${rows.length} data row(s); at least 2 are needed.` }] };
  }
  const warnings: { message: string; column?: string }[] = [];
  if (rows.length < 4) {
    warnings.push({ message: `Only ${rows.length} data rows: interpolation between so few points is coarse.` });
  }
  const delivered = { abscissa: x } as DeliveredTable;
  for (const name of DERIVATIVE_NAMES) {
    const column = columns.data.columns.get(name);
    if (column) delivered[name] = column;
    else {
      delivered[name] = x.map(() => 0);
      warnings.push({ column: name, message: `${name}* is not in the file: taken as 0 at every row.` });
    }
  }
  return { ok: true, delivered, warnings };
}
