import { convertConvention, type DerivativeConvention } from "@shared/engine/aero/convert-convention";
import { DERIVATIVE_NAMES, type DerivativeName, type StudyAerodynamics } from "@shared/schemas/study";

export type TabulatedAerodynamics = Extract<StudyAerodynamics, { model: "tabulated" }>;
export type GridColumn = "Ur" | DerivativeName;
export const GRID_COLUMNS: readonly GridColumn[] = ["Ur", ...DERIVATIVE_NAMES];

/** One row of the editable table: the text as typed, so a half-typed "-0." is not lost. */
export type GridRow = Record<GridColumn, string>;

export interface CellError {
  /** 0-based row index in the grid. */
  row: number;
  column: GridColumn | null;
  message: string;
}

export const columnLabel = (column: GridColumn) => (column === "Ur" ? "Ur" : `${column}*`);

export function emptyRow(): GridRow {
  return Object.fromEntries(GRID_COLUMNS.map((c) => [c, ""])) as GridRow;
}

export function gridFromTable(table: TabulatedAerodynamics): GridRow[] {
  return table.reducedVelocity.map((ur, i) => {
    const row = emptyRow();
    row.Ur = String(ur);
    for (const name of DERIVATIVE_NAMES) {
      const column = table[name];
      row[name] = column ? String(column[i]) : "";
    }
    return row;
  });
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export function parseCell(text: string): number | null {
  const trimmed = text.trim();
  return NUMBER.test(trimmed) ? Number(trimmed) : null;
}

export type GridParse =
  | { ok: true; table: Pick<TabulatedAerodynamics, "reducedVelocity" | DerivativeName> }
  | { ok: false; errors: CellError[] };

/**
 * Reads the grid into the study's tabulated columns. A derivative column left wholly empty is omitted (the
 * format reads a missing column as zeros); a single empty cell in a filled column is an error, as is text that
 * is not a number or a reduced velocity that does not increase.
 */
export function parseGrid(rows: readonly GridRow[]): GridParse {
  const errors: CellError[] = [];
  if (rows.length < 2) errors.push({ row: Math.max(rows.length - 1, 0), column: null, message: "The table needs at least 2 rows." });
  const filled = new Set(DERIVATIVE_NAMES.filter((name) => rows.some((r) => r[name].trim() !== "")));
  const columns: Partial<Record<GridColumn, number[]>> = { Ur: [] };
  for (const name of filled) columns[name] = [];
  rows.forEach((row, i) => {
    for (const column of GRID_COLUMNS) {
      if (column !== "Ur" && !filled.has(column)) continue;
      const text = row[column].trim();
      const value = parseCell(text);
      if (text === "") errors.push({ row: i, column, message: `${columnLabel(column)} is empty` });
      else if (value === null) errors.push({ row: i, column, message: `${columnLabel(column)} "${text}" is not a number` });
      else if (column === "Ur" && !(value > 0)) errors.push({ row: i, column, message: "Ur must be greater than 0" });
      columns[column]!.push(value ?? Number.NaN);
    }
    const ur = columns.Ur!;
    if (i > 0 && Number.isFinite(ur[i]) && Number.isFinite(ur[i - 1]) && !(ur[i] > ur[i - 1])) {
      errors.push({ row: i, column: "Ur", message: `Ur must be greater than the row above (${ur[i - 1]})` });
    }
  });
  if (errors.length > 0) return { ok: false, errors };
  const table: Pick<TabulatedAerodynamics, "reducedVelocity" | DerivativeName> = { reducedVelocity: columns.Ur! };
  for (const name of filled) table[name] = columns[name];
  return { ok: true, table };
}

const HEADER_ALIASES: Record<string, GridColumn> = {};
for (const name of DERIVATIVE_NAMES) {
  HEADER_ALIASES[name.toLowerCase()] = name;
  HEADER_ALIASES[`${name.toLowerCase()}*`] = name;
}

/** Recognises the abscissa column's header: Ur, U/fB, K, k … (any of them; the convention says which). */
const ABSCISSA_HEADER = /^(ur|u\/\(?fb\)?|vr|u\*|reduced[ _-]?velocity|k|kappa|reduced[ _-]?frequency|k-half|ur-half)$/i;

export interface CsvImport {
  rows: GridRow[];
  /** Row errors, with `row` pointing at the grid row the CSV line became. */
  errors: CellError[];
  /** CSV line number of each grid row (1-based, counting the header), for messages. */
  lines: number[];
}

/**
 * Turns delivered CSV text (a header row naming the abscissa and H1..A4, then one row per reduced velocity)
 * into grid rows in the study convention. Rows that are not numbers keep their text and get an error in
 * place; every valid number is converted with the engine's `convertConvention`. Rows are put in increasing
 * Ur when every abscissa is valid.
 */
export function importDerivativeCsv(records: readonly string[][], convention: DerivativeConvention): CsvImport | { fatal: string } {
  const nonEmpty = records.map((cells, i) => ({ cells, line: i + 1 })).filter((r) => r.cells.some((c) => c.trim() !== ""));
  if (nonEmpty.length < 2) return { fatal: "The file needs a header row and at least one data row." };
  const header = nonEmpty[0].cells.map((h) => h.trim());
  const map: Array<GridColumn | null> = header.map((h, i) =>
    i === 0 && ABSCISSA_HEADER.test(h) ? "Ur" : (HEADER_ALIASES[h.toLowerCase()] ?? null),
  );
  if (map[0] !== "Ur") {
    return { fatal: `The first column must be the reduced velocity or frequency (Ur, U/fB, K or k); found "${header[0] ?? ""}".` };
  }
  const unknown = header.filter((_, i) => map[i] === null);
  if (unknown.length > 0) {
    return { fatal: `Unknown column${unknown.length > 1 ? "s" : ""} ${unknown.map((u) => `"${u}"`).join(", ")}: use H1…H4 and A1…A4 (with or without *).` };
  }
  const rows: GridRow[] = [];
  const errors: CellError[] = [];
  const lines: number[] = [];
  nonEmpty.slice(1).forEach(({ cells, line }) => {
    const index = rows.length;
    const row = emptyRow();
    if (cells.length !== header.length) {
      errors.push({ row: index, column: null, message: `Line ${line} has ${cells.length} values for ${header.length} columns` });
    }
    const delivered: Partial<Record<GridColumn, number>> = {};
    map.forEach((column, i) => {
      if (!column) return;
      const text = (cells[i] ?? "").trim();
      row[column] = text;
      const value = parseCell(text);
      if (value === null) {
        errors.push({ row: index, column, message: `Line ${line}: ${columnLabel(column)} ${text === "" ? "is empty" : `"${text}" is not a number`}` });
      } else if (column === "Ur" && !(value > 0)) {
        errors.push({ row: index, column, message: `Line ${line}: the abscissa must be greater than 0` });
      } else {
        delivered[column] = value;
      }
    });
    if (delivered.Ur !== undefined) {
      const one = convertConvention({
        ...convention,
        abscissaValues: [delivered.Ur],
        ...Object.fromEntries(DERIVATIVE_NAMES.filter((n) => delivered[n] !== undefined).map((n) => [n, [delivered[n]]])),
      });
      row.Ur = formatNumber(one.reducedVelocity[0]);
      for (const name of DERIVATIVE_NAMES) {
        const converted = one[name];
        if (converted) row[name] = formatNumber(converted[0]);
      }
    }
    rows.push(row);
    lines.push(line);
  });
  if (!errors.some((e) => e.column === "Ur")) {
    const order = rows.map((_, i) => i).sort((a, b) => Number(rows[a].Ur) - Number(rows[b].Ur));
    const remap = new Map(order.map((from, to) => [from, to]));
    return {
      rows: order.map((i) => rows[i]),
      lines: order.map((i) => lines[i]),
      errors: errors.map((e) => ({ ...e, row: remap.get(e.row)! })),
    };
  }
  return { rows, errors, lines };
}

/** Up to 6 significant digits, without float noise (2·0.05 → "0.1", not "0.1000000001"). */
export function formatNumber(value: number): string {
  return String(Number(value.toPrecision(6)));
}
