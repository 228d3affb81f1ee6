import { describe, expect, it } from "vitest";
import { emptyRow, gridFromTable, importDerivativeCsv, parseGrid, type GridRow } from "@/features/studies/utils/derivative-grid";

const row = (cells: Partial<GridRow>): GridRow => ({ ...emptyRow(), ...cells });

describe("parseGrid", () => {
  it("reads a clean table, omitting derivative columns left wholly empty", () => {
    const parsed = parseGrid([row({ Ur: "2", H1: "-0.6", A2: "-0.03" }), row({ Ur: "4", H1: "-1.9", A2: "-0.15" })]);
    expect(parsed).toEqual({ ok: true, table: { reducedVelocity: [2, 4], H1: [-0.6, -1.9], A2: [-0.03, -0.15] } });
  });

  it("marks text that is not a number, an empty cell in a filled column and a reduced velocity that does not increase", () => {
    const parsed = parseGrid([row({ Ur: "4", H1: "-1" }), row({ Ur: "4", H1: "" }), row({ Ur: "6", H1: "1,5" })]);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.errors).toEqual([
      { row: 1, column: "H1", message: "H1* is empty" },
      { row: 1, column: "Ur", message: "Ur must be greater than the row above (4)" },
      { row: 2, column: "H1", message: 'H1* "1,5" is not a number' },
    ]);
  });

  it("round-trips a tabulated block through the grid", () => {
    const table = { model: "tabulated" as const, interpolation: "linear" as const, reducedVelocity: [2, 5, 9], H3: [-0.3, -2, -7.5], A3: [0.1, 0.5, 2] };
    const parsed = parseGrid(gridFromTable(table));
    expect(parsed).toEqual({ ok: true, table: { reducedVelocity: [2, 5, 9], H3: [-0.3, -2, -7.5], A3: [0.1, 0.5, 2] } });
  });
});

describe("importDerivativeCsv", () => {
  it("converts a set delivered on 2B with heave up and K as abscissa to the study convention, rows by increasing Ur", () => {
    // docs/conventions.md §Self-excited forces: values on 2B are half of ours; with h and L upward H2*, H3*, A1*, A4* change sign; Ur = 2π/K.
    const records = [["K", "H1", "H2", "H3", "A1", "A2"], ["1.0", "-1", "-0.2", "-0.5", "0.3", "-0.1"], ["0.5", "-2", "-0.1", "-1.5", "0.6", "-0.3"]];
    const imported = importDerivativeCsv(records, { abscissa: "K", normalisation: "2B", sign: "h-up" });
    if ("fatal" in imported) throw new Error(imported.fatal);
    expect(imported.errors).toEqual([]);
    expect(imported.rows.map((r) => Number(r.Ur))).toEqual([Number((2 * Math.PI).toPrecision(6)), Number((4 * Math.PI).toPrecision(6))]);
    expect(imported.rows[0]).toMatchObject({ H1: "-2", H2: "0.4", H3: "1", A1: "-0.6", A2: "-0.2", H4: "" });
    expect(imported.rows[1]).toMatchObject({ H1: "-4", H2: "0.2", H3: "3", A1: "-1.2", A2: "-0.6" });
    expect(imported.lines).toEqual([2, 3]);
  });

  it("keeps a bad value as typed, reports its file line, and flags a row with too few values", () => {
    const records = [["Ur", "H1", "A2"], ["2", "-0.6", "-0.03"], ["4", "abc", "-0.15"], ["6", "-3.3"]];
    const imported = importDerivativeCsv(records, { abscissa: "Ur", normalisation: "B", sign: "h-down" });
    if ("fatal" in imported) throw new Error(imported.fatal);
    expect(imported.rows[1].H1).toBe("abc");
    expect(imported.errors).toEqual([
      { row: 1, column: "H1", message: 'Line 3: H1* "abc" is not a number' },
      { row: 2, column: null, message: "Line 4 has 2 values for 3 columns" },
      { row: 2, column: "A2", message: "Line 4: A2* is empty" },
    ]);
  });

  it("refuses a file whose first column is not an abscissa or that names unknown columns", () => {
    const convention = { abscissa: "Ur", normalisation: "B", sign: "h-down" } as const;
    expect(importDerivativeCsv([["H1", "H2"], ["1", "2"]], convention)).toEqual({
      fatal: 'The first column must be the reduced velocity or frequency (Ur, U/fB, K or k); found "H1".',
    });
    expect(importDerivativeCsv([["Ur", "H5"], ["1", "2"]], convention)).toMatchObject({ fatal: expect.stringContaining('"H5"') });
  });
});
