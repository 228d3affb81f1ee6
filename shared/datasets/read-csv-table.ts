import Papa from "papaparse";
import { capList, clipValue, quoteValue } from "../message-bounds";
import { denormalProblem } from "../schemas/input-rules";
import type { UploadIssue } from "../schemas/datasets";
import { MAX_TABLE_ROWS } from "../schemas/study";
import { decodeUtf8Strict, describeUtf8Error } from "../utf8";

/** A CSV file read into trimmed cells, with the line number of every data row (the header is line 1). */
export interface CsvTable {
  header: string[];
  rows: { line: number; cells: string[] }[];
}

export type CsvReadResult = { ok: true; table: CsvTable } | { ok: false; issues: UploadIssue[] };

const UTF8_BOM = [0xef, 0xbb, 0xbf];

/**
 * Decodes an uploaded CSV as UTF-8 (a BOM is removed) and splits it with papaparse into a header and data rows.
 *
 * **Notes**: only commas separate values. A file whose header holds semicolons (or tabs) but no comma is
 * refused with a message saying so, rather than guessed: semicolon files usually come with decimal commas,
 * and reading "0,25" wrongly would silently change the data. UTF-16 and other encodings are refused with the
 * line of the first byte that is not UTF-8. Blank lines are skipped; line numbers count them.
 */
export function readCsvTable(bytes: Uint8Array): CsvReadResult {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return fail("The file is encoded as UTF-16. Save it as UTF-8 (\"CSV UTF-8\") and upload it again.");
  }
  const body = UTF8_BOM.every((b, i) => bytes[i] === b) ? bytes.subarray(3) : bytes;
  const decoded = decodeUtf8Strict(body);
  if (!decoded.ok) {
    return {
      ok: false,
      issues: [
        {
          row: decoded.line,
          message:
            `The file is not UTF-8: ${describeUtf8Error(decoded)} cannot be read (Windows-1252 or Latin-1?). ` +
            "Save it as UTF-8 (\"CSV UTF-8\") and upload it again.",
        },
      ],
    };
  }
  const text = decoded.text;
  if (text.includes("\u0000")) return fail("The file contains NUL bytes: it is not a text CSV file.");
  if (text.trim() === "") return fail("The file is empty.");

  const parsed = Papa.parse<string[]>(text, { delimiter: ",", header: false, skipEmptyLines: false });
  const records = parsed.data.map((cells, i) => ({ line: i + 1, cells: cells.map((c) => c.trim()) }));
  const nonBlank = records.filter((r) => r.cells.some((c) => c !== ""));
  if (nonBlank.length === 0) {
    // Only separators (",,,") and blanks: no header cell has a name, and there is no value to read.
    const first = records.find((r) => r.cells.length > 1) ?? records[0];
    return {
      ok: false,
      issues: [
        {
          row: first.line,
          column: "column 1",
          message: "the header has no column names: the file holds only commas and blank values, no header and no numbers",
        },
      ],
    };
  }
  const [head, ...rows] = nonBlank;
  if (rows.length > MAX_TABLE_ROWS) {
    return {
      ok: false,
      issues: [
        {
          row: rows[MAX_TABLE_ROWS].line,
          message: `The file has ${rows.length} data rows; at most ${MAX_TABLE_ROWS} are accepted (line ${rows[MAX_TABLE_ROWS].line} is row ${MAX_TABLE_ROWS + 1}).`,
        },
      ],
    };
  }
  const headerLine = text.split(/\r?\n/).find((l) => l.trim() !== "") ?? "";
  if (head.cells.length === 1 && /[;\t]/.test(headerLine)) {
    const separator = headerLine.includes(";") ? "semicolons (;)" : "tabs";
    return {
      ok: false,
      issues: [
        {
          row: head.line,
          message:
            `The values are separated by ${separator}, not commas. Export the file as comma-separated CSV with a ` +
            "decimal point (e.g. 0.25, not 0,25).",
        },
      ],
    };
  }
  const quoteErrors = parsed.errors.filter((e) => e.type === "Quotes");
  if (quoteErrors.length > 0) {
    return {
      ok: false,
      issues: capIssues(quoteErrors.map((e) => ({ row: (e.row ?? 0) + 1, message: `Unbalanced quotes: ${e.message}.` }))),
    };
  }
  return { ok: true, table: { header: head.cells, rows } };
}

function fail(message: string): CsvReadResult {
  return { ok: false, issues: [{ message }] };
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A finite number from a cell, or the reason it is not one. */
export function readNumber(cell: string): { ok: true; value: number } | { ok: false; message: string } {
  if (cell === "") return { ok: false, message: "is empty: a number is needed" };
  if (/^[+-]?(nan|inf|infinity)$/i.test(cell)) return { ok: false, message: `is ${cell}: only finite numbers are accepted` };
  if (!NUMBER.test(cell)) {
    const hint = /^[+-]?\d+,\d+$/.test(cell) ? " (decimal comma? use a point)" : "";
    return { ok: false, message: `${quoteValue(cell)} is not a number${hint}` };
  }
  const value = Number(cell);
  if (!Number.isFinite(value)) return { ok: false, message: `${quoteValue(cell)} is out of the range of numbers` };
  const denormal = denormalProblem(value);
  if (denormal) return { ok: false, message: `${quoteValue(cell)} ${denormal}` };
  return { ok: true, value };
}

/** At most `MAX_REPORTED_ISSUES` problems of one file; the rest are summarised in one line. */
export function capIssues(issues: UploadIssue[]): UploadIssue[] {
  return capList(issues, (count) => ({ message: `… and ${count} more problems.` }));
}

/** A header cell as an issue's `column`: at most 100 characters, or its position when it is blank. */
export function columnLabel(cell: string, index: number): string {
  return cell ? clipValue(cell) : `column ${index + 1}`;
}
