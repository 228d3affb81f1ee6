import { Fragment, useId, type ClipboardEvent, type KeyboardEvent } from "react";
import { cn } from "@/lib/cn";
import {
  columnLabel,
  emptyRow,
  GRID_COLUMNS,
  type CellError,
  type GridColumn,
  type GridRow,
} from "@/features/studies/utils/derivative-grid";

interface DerivativeTableProps {
  rows: readonly GridRow[];
  errors: readonly CellError[];
  readOnly: boolean;
  onChange: (rows: GridRow[]) => void;
}

/**
 * The flutter-derivative table as an editable grid: one row per reduced velocity, a text input per cell (so a
 * half-typed number is kept), errors marked on the cell and spelled out on a line under their row. Pasting a
 * block copied from a spreadsheet fills the cells from the one pasted into; Enter moves down a row.
 */
export function DerivativeTable({ rows, errors, readOnly, onChange }: DerivativeTableProps) {
  const tableId = useId();
  const cellId = (row: number, column: GridColumn) => `${tableId}-${row}-${column}`;
  const errorsByRow = new Map<number, CellError[]>();
  for (const error of errors) errorsByRow.set(error.row, [...(errorsByRow.get(error.row) ?? []), error]);

  const setCell = (row: number, column: GridColumn, text: string) => {
    onChange(rows.map((r, i) => (i === row ? { ...r, [column]: text } : r)));
  };

  const onPaste = (row: number, column: GridColumn) => (event: ClipboardEvent<HTMLInputElement>) => {
    const text = event.clipboardData.getData("text/plain");
    if (!/[\t\n,;]/.test(text.trim())) return;
    event.preventDefault();
    const block = text.replace(/\r/g, "").split("\n").filter((line) => line.trim() !== "")
      .map((line) => line.split(/\t|;|,/).map((cell) => cell.trim()));
    const start = GRID_COLUMNS.indexOf(column);
    const next = rows.map((r) => ({ ...r }));
    block.forEach((cells, k) => {
      const target = row + k;
      while (next.length <= target) next.push(emptyRow());
      cells.forEach((cell, c) => {
        const col = GRID_COLUMNS[start + c];
        if (col) next[target][col] = cell;
      });
    });
    onChange(next);
  };

  const onKeyDown = (row: number, column: GridColumn) => (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === "Enter" || (event.key === "ArrowDown" && event.altKey)) {
      event.preventDefault();
      document.getElementById(cellId(row + 1, column))?.focus();
    } else if (event.key === "ArrowUp" && event.altKey) {
      event.preventDefault();
      document.getElementById(cellId(row - 1, column))?.focus();
    }
  };

  return (
    <div className="relative overflow-x-auto rounded-md border border-ink-200">
      <table className="w-full border-collapse text-sm" aria-describedby={`${tableId}-help`}>
        <caption id={`${tableId}-help`} className="sr-only">
          Flutter derivatives by reduced velocity Ur = U/(fB), study convention. Enter moves down a row; paste a
          block copied from a spreadsheet into any cell.
        </caption>
        <thead>
          <tr className="bg-ink-50 text-xs text-ink-700">
            <th scope="col" className="w-8 px-1 py-1 text-right font-semibold">#</th>
            {GRID_COLUMNS.map((column) => (
              <th key={column} scope="col" className="px-1 py-1 text-right font-semibold">
                {columnLabel(column)}
              </th>
            ))}
            {readOnly ? null : <th scope="col" className="w-7"><span className="sr-only">Remove row</span></th>}
          </tr>
        </thead>
        <tbody>
          {rows.map((row, r) => {
            const rowErrors = errorsByRow.get(r) ?? [];
            return (
              <Fragment key={r}>
                <tr className={cn("border-t border-ink-100", rowErrors.length > 0 && "bg-signal-50")}>
                  <th scope="row" className="num px-1 text-right text-xs font-normal text-ink-600">{r + 1}</th>
                  {GRID_COLUMNS.map((column) => {
                    const cellError = rowErrors.find((e) => e.column === column);
                    return (
                      <td key={column} className="p-0">
                        {readOnly ? (
                          <span className="num block px-1.5 py-1 text-right">{row[column] || "—"}</span>
                        ) : (
                          <input
                            id={cellId(r, column)}
                            value={row[column]}
                            inputMode="decimal"
                            aria-label={`Row ${r + 1}, ${columnLabel(column)}`}
                            aria-invalid={cellError ? true : undefined}
                            title={cellError?.message}
                            onChange={(event) => setCell(r, column, event.target.value)}
                            onPaste={onPaste(r, column)}
                            onKeyDown={onKeyDown(r, column)}
                            className={cn(
                              "num block h-7 w-full min-w-[3.6rem] border border-transparent bg-transparent px-1.5 text-right",
                              "hover:border-ink-200 focus-visible:border-tide-600 focus-visible:bg-white",
                              cellError && "border-signal-600 bg-white text-signal-700",
                            )}
                          />
                        )}
                      </td>
                    );
                  })}
                  {readOnly ? null : (
                    <td className="p-0 text-center">
                      <button
                        type="button"
                        onClick={() => onChange(rows.filter((_, i) => i !== r))}
                        className="size-6 rounded-sm text-ink-500 hover:bg-ink-100 hover:text-signal-700"
                        aria-label={`Remove row ${r + 1}`}
                      >
                        ×
                      </button>
                    </td>
                  )}
                </tr>
                {rowErrors.length > 0 ? (
                  <tr className="bg-signal-50">
                    <td />
                    <td colSpan={GRID_COLUMNS.length + (readOnly ? 0 : 1)} className="px-1.5 pb-1 text-xs font-semibold text-signal-700" role="alert">
                      Row {r + 1}: {rowErrors.map((e) => e.message).join("; ")}
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
