import type { UploadIssue } from "../schemas/datasets";
import { quoteValue } from "../message-bounds";
import { columnLabel, readNumber, type CsvTable } from "./read-csv-table";

export interface NumericColumns {
  /** Values by canonical column name, in file order. */
  columns: Map<string, number[]>;
  lines: number[];
}

/**
 * Reads every data row of `table` into numeric columns, checking field counts and numbers, and that the first
 * column (the abscissa) increases strictly. `names` maps each header cell (already canonical) to its column.
 * Every problem is reported with its line and column; nothing is returned when there is one.
 */
export function readNumericColumns(
  table: CsvTable,
  names: string[],
  abscissaLabel: string,
  /** "increasing", or "monotonic": either direction, set by the first two rows (a K column sorted by Ur). */
  order: "increasing" | "monotonic" = "increasing",
): { ok: true; data: NumericColumns } | { ok: false; issues: UploadIssue[] } {
  const issues: UploadIssue[] = [];
  const columns = new Map(names.map((n) => [n, [] as number[]]));
  const lines: number[] = [];
  const abscissaName = names[0];
  let previous: { value: number; line: number } | null = null;
  let sign = 0;
  for (const { line, cells } of table.rows) {
    if (cells.length !== names.length) {
      issues.push({ row: line, message: `has ${cells.length} values; the header has ${names.length} columns` });
      continue;
    }
    let rowOk = true;
    cells.forEach((cell, j) => {
      const read = readNumber(cell);
      if (read.ok) columns.get(names[j])!.push(read.value);
      else {
        rowOk = false;
        issues.push({ row: line, column: names[j], message: read.message });
      }
    });
    if (!rowOk) continue;
    lines.push(line);
    const x = columns.get(abscissaName)!.at(-1)!;
    if (previous && x === previous.value) {
      issues.push({ row: line, column: abscissaName, message: `repeats ${x} from line ${previous.line}: duplicate ${abscissaLabel}` });
    } else if (previous) {
      const step = Math.sign(x - previous.value);
      if (sign === 0) sign = order === "increasing" ? 1 : step;
      if (step !== sign) {
        const [relation, rule] = sign > 0 ? ["smaller", "increase"] : ["larger", "decrease"];
        const either = order === "monotonic" ? " (in one direction throughout)" : "";
        issues.push({
          row: line,
          column: abscissaName,
          message: `${x} is ${relation} than ${previous.value} on line ${previous.line}: ${abscissaLabel} must ${rule} strictly from row to row${either}`,
        });
      }
    }
    previous = { value: x, line };
  }
  if (issues.length > 0) return { ok: false, issues };
  return { ok: true, data: { columns, lines } };
}

/** Header cells as written → problems with unknown or repeated names. */
export function checkHeader(header: string[], canonical: (cell: string) => string | null, expected: string): UploadIssue[] {
  const issues: UploadIssue[] = [];
  const seen = new Set<string>();
  header.forEach((cell, j) => {
    const name = canonical(cell);
    if (name === null) {
      issues.push({
        row: 1,
        column: columnLabel(cell, j),
        message: cell ? `${quoteValue(cell)} is not a known column; expected ${expected}` : `column ${j + 1} has no name; expected ${expected}`,
      });
    } else if (seen.has(name)) {
      issues.push({ row: 1, column: columnLabel(cell, j), message: `column ${name} appears twice` });
    } else seen.add(name);
  });
  return issues;
}
