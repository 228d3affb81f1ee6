import Papa from "papaparse";
import type { UploadIssue } from "../schemas/datasets";

/** A CSV file read into trimmed cells, with the line number of every data row (the header is line 1). */
export interface CsvTable {
  header: string[];
  rows: { line: number; cells: string[] }[];
}

export type CsvReadResult = { ok: true; table: CsvTable } | { ok: false; issues: UploadIssue[] };

const UTF8_BOM = [0xef, 0xbb, 0xbf];

/** Line number (1-based) of byte `offset` in `bytes`. */
function lineOfByte(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < bytes.length; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

/** Offset of the first byte that is not part of a valid UTF-8 sequence. */
function firstInvalidUtf8(bytes: Uint8Array): number {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  let lo = 0;
  let hi = bytes.length;
  // Binary search on the longest valid prefix; a cut inside a multi-byte sequence is tolerated by `stream`.
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    try {
      decoder.decode(bytes.subarray(0, mid), { stream: true });
      decoder.decode();
      lo = mid;
    } catch {
      hi = mid;
    }
  }
  return lo;
}

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
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(body);
  } catch {
    const at = firstInvalidUtf8(body);
    return {
      ok: false,
      issues: [
        {
          row: lineOfByte(body, at),
          message:
            `The file is not UTF-8: byte 0x${body[at]?.toString(16).padStart(2, "0")} at line ${lineOfByte(body, at)} ` +
            "cannot be read (Windows-1252 or Latin-1?). Save it as UTF-8 (\"CSV UTF-8\") and upload it again.",
        },
      ],
    };
  }
  if (text.includes("\u0000")) return fail("The file contains NUL bytes: it is not a text CSV file.");
  if (text.trim() === "") return fail("The file is empty.");

  const parsed = Papa.parse<string[]>(text, { delimiter: ",", header: false, skipEmptyLines: false });
  const records = parsed.data.map((cells, i) => ({ line: i + 1, cells: cells.map((c) => c.trim()) }));
  const nonBlank = records.filter((r) => r.cells.some((c) => c !== ""));
  const [head, ...rows] = nonBlank;
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
      issues: quoteErrors.map((e) => ({ row: (e.row ?? 0) + 1, message: `Unbalanced quotes: ${e.message}.` })),
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
    return { ok: false, message: `"${cell}" is not a number${hint}` };
  }
  const value = Number(cell);
  if (!Number.isFinite(value)) return { ok: false, message: `"${cell}" is out of the range of numbers` };
  return { ok: true, value };
}

/** Most issues reported for one file; the rest are summarised in one line. */
export const MAX_ISSUES = 50;

export function capIssues(issues: UploadIssue[]): UploadIssue[] {
  if (issues.length <= MAX_ISSUES) return issues;
  return [...issues.slice(0, MAX_ISSUES), { message: `… and ${issues.length - MAX_ISSUES} more problems.` }];
}
