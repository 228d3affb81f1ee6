import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { useState } from "react";
import { afterEach, describe, expect, it } from "vitest";
import { DerivativeTable } from "@/features/studies/components/derivative-table";
import { emptyRow, parseGrid, type GridRow } from "@/features/studies/utils/derivative-grid";

function Harness({ initial, onRows }: { initial: GridRow[]; onRows: (rows: GridRow[]) => void }) {
  const [rows, setRows] = useState(initial);
  const parsed = parseGrid(rows);
  return (
    <DerivativeTable
      rows={rows}
      errors={parsed.ok ? [] : parsed.errors}
      readOnly={false}
      onChange={(next) => {
        setRows(next);
        onRows(next);
      }}
    />
  );
}

describe("DerivativeTable", () => {
  afterEach(cleanup);

  it("fills cells from a block pasted from a spreadsheet, adding rows as needed", () => {
    let latest: GridRow[] = [];
    render(<Harness initial={[{ ...emptyRow(), Ur: "2" }]} onRows={(rows) => (latest = rows)} />);

    fireEvent.paste(screen.getByLabelText("Row 1, Ur"), {
      clipboardData: { getData: () => "2\t-0.6\t-0.1\r\n4\t-1.9\t-0.5\r\n6\t-3.3\t-0.8\r\n" },
    });

    expect(latest.map((r) => [r.Ur, r.H1, r.H2])).toEqual([["2", "-0.6", "-0.1"], ["4", "-1.9", "-0.5"], ["6", "-3.3", "-0.8"]]);
    expect((screen.getByLabelText("Row 3, H1*") as HTMLInputElement).value).toBe("-3.3");
  });

  it("marks a bad cell and spells out the error on a line under its row", () => {
    render(<Harness initial={[{ ...emptyRow(), Ur: "2", A2: "-0.03" }, { ...emptyRow(), Ur: "4", A2: "abc" }]} onRows={() => {}} />);

    expect(screen.getByLabelText("Row 2, A2*").getAttribute("aria-invalid")).toBe("true");
    expect(screen.getByLabelText("Row 1, A2*").getAttribute("aria-invalid")).toBeNull();
    expect(screen.getByRole("alert").textContent).toBe('Row 2: A2* "abc" is not a number');
  });

  it("removes a row with its button", () => {
    let latest: GridRow[] = [];
    render(<Harness initial={[{ ...emptyRow(), Ur: "2" }, { ...emptyRow(), Ur: "4" }, { ...emptyRow(), Ur: "6" }]} onRows={(rows) => (latest = rows)} />);

    fireEvent.click(screen.getByRole("button", { name: "Remove row 2" }));

    expect(latest.map((r) => r.Ur)).toEqual(["2", "6"]);
  });
});
