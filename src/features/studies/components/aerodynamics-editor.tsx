import Papa from "papaparse";
import { useId, useMemo, useRef, useState, type ChangeEvent } from "react";
import type { DerivativeConvention } from "@shared/engine/aero/convert-convention";
import type { DatasetDto } from "@shared/schemas/datasets";
import type { StudyAerodynamics } from "@shared/schemas/study";
import { Button } from "@/components/ui/button";
import { Plot } from "@/components/ui/plot";
import { cn } from "@/lib/cn";
import { DatasetPicker, isDerivativeSet, matchingDataset } from "@/features/studies/components/dataset-picker";
import { DerivativeTable } from "@/features/studies/components/derivative-table";
import { QuasiSteadyFields } from "@/features/studies/components/quasi-steady-fields";
import { SelectField } from "@/features/studies/components/select-field";
import { useDebouncedValue } from "@/features/studies/hooks/use-debounced-value";
import { aeroFigure } from "@/features/studies/utils/aero-figure";
import {
  emptyRow,
  gridFromTable,
  importDerivativeCsv,
  parseGrid,
  type CellError,
  type GridRow,
  type TabulatedAerodynamics,
} from "@/features/studies/utils/derivative-grid";

type Choice = "flat-plate" | "quasi-steady" | "dataset" | "tabulated";

const CHOICES: Array<{ value: Choice; label: string; hint: string }> = [
  { value: "flat-plate", label: "Thin plate", hint: "Theodorsen's flat plate; a first estimate" },
  { value: "quasi-steady", label: "Quasi-steady", hint: "From static coefficient slopes; not for flutter" },
  { value: "dataset", label: "Data set", hint: "Derivatives from one of the alternative's uploaded test data sets" },
  { value: "tabulated", label: "Own table", hint: "Flutter derivatives typed, pasted or loaded from a CSV file" },
];

/** Thin-plate limits (C_L′ = 2π, C_D = 0, C_M′ = π/2) as a neutral start for quasi-steady slopes. */
const DEFAULT_QS = { model: "quasi-steady", liftSlope: 2 * Math.PI, dragCoefficient: 0, momentSlope: Math.PI / 2 } as const;

interface AerodynamicsEditorProps {
  value: StudyAerodynamics;
  readOnly: boolean;
  /** Flutter-derivative data sets of the study's deck alternative. */
  datasets: readonly DatasetDto[];
  datasetsError: string | null;
  /** A valid block, or null with the grid's errors while the table cannot be read. */
  onChange: (value: StudyAerodynamics | null, errors: CellError[]) => void;
}

/**
 * Chooses and edits the study's aerodynamics: a measured table (typed, pasted, uploaded as CSV in a stated
 * convention, or copied from one of the alternative's data sets), Theodorsen's thin plate, or quasi-steady
 * slopes; the derivatives are drawn against Ur as the engine will interpolate them.
 */
export function AerodynamicsEditor({ value, readOnly, datasets, datasetsError, onChange }: AerodynamicsEditorProps) {
  const groupId = useId();
  const [rows, setRows] = useState<GridRow[]>(() =>
    value.model === "tabulated" ? gridFromTable(value) : [emptyRow(), emptyRow()],
  );
  const [interpolation, setInterpolation] = useState<TabulatedAerodynamics["interpolation"]>(
    value.model === "tabulated" ? value.interpolation : "monotone-cubic",
  );
  const [rowNotes, setRowNotes] = useState<CellError[]>([]);
  const [importMessage, setImportMessage] = useState<{ tone: "error" | "info"; text: string } | null>(null);
  const [convention, setConvention] = useState<DerivativeConvention>({ abscissa: "Ur", normalisation: "B", sign: "h-down" });
  const fileInput = useRef<HTMLInputElement>(null);
  const derivativeSets = useMemo(() => datasets.filter(isDerivativeSet), [datasets]);
  const staticSets = useMemo(() => datasets.filter((d) => d.kind === "static-coefficients" && d.slopes), [datasets]);
  const [choice, setChoice] = useState<Choice>(() =>
    value.model === "tabulated" ? (matchingDataset(value, derivativeSets) ? "dataset" : "tabulated") : value.model,
  );
  const activeSet = choice === "dataset" ? matchingDataset(value, derivativeSets) : null;

  const gridParse = useMemo(() => parseGrid(rows), [rows]);
  const gridErrors = gridParse.ok ? [] : gridParse.errors;
  const shownErrors = [...rowNotes, ...gridErrors.filter((e) => !rowNotes.some((n) => n.row === e.row && n.column === e.column))];

  const emitTable = (nextRows: GridRow[], nextInterpolation = interpolation, notes = rowNotes) => {
    const parsed = parseGrid(nextRows);
    if (parsed.ok && notes.length === 0) {
      onChange({ model: "tabulated", interpolation: nextInterpolation, ...parsed.table }, []);
    } else {
      onChange(null, [...notes, ...(parsed.ok ? [] : parsed.errors)]);
    }
  };

  const choose = (next: Choice) => {
    if (next === choice) return;
    setChoice(next);
    if (next === "flat-plate") onChange({ model: "flat-plate" }, []);
    else if (next === "quasi-steady") onChange(value.model === "quasi-steady" ? value : { ...DEFAULT_QS }, []);
    else if (next === "dataset") {
      if (derivativeSets[0]) copyDataset(derivativeSets[0].id);
      else onChange(null, [{ row: 0, column: null, message: "This alternative has no flutter-derivative data set yet." }]);
    } else emitTable(rows);
  };

  const editRows = (next: GridRow[]) => {
    const edited = new Set(next.map((r, i) => (r !== rows[i] ? i : -1)));
    const notes = rowNotes.filter((n) => !edited.has(n.row) && n.row < next.length);
    setRows(next);
    setRowNotes(notes);
    emitTable(next, interpolation, notes);
  };

  const loadCsv = (text: string, source: string) => {
    const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false, delimitersToGuess: [",", ";", "\t"] });
    const imported = importDerivativeCsv(parsed.data, convention);
    if ("fatal" in imported) {
      setImportMessage({ tone: "error", text: `${source}: ${imported.fatal}` });
      return;
    }
    const notes = imported.errors.filter((e) => e.column === null);
    setRows(imported.rows);
    setRowNotes(notes);
    const bad = new Set(imported.errors.map((e) => e.row)).size;
    setImportMessage(
      bad > 0
        ? { tone: "error", text: `${source}: ${imported.rows.length} rows read, ${bad} with errors — fix them in the table below.` }
        : { tone: "info", text: `${source}: ${imported.rows.length} rows read and converted to the study convention.` },
    );
    emitTable(imported.rows, interpolation, notes);
  };

  const onFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = "";
    if (!file) return;
    if (file.size > 1024 * 1024) {
      setImportMessage({ tone: "error", text: `${file.name} is larger than 1 MB; is it the right file?` });
      return;
    }
    loadCsv(await file.text(), file.name);
  };

  function copyDataset(datasetId: string) {
    const dataset = derivativeSets.find((d) => d.id === datasetId);
    if (!dataset) return;
    const converted = dataset.converted;
    const table: TabulatedAerodynamics = { model: "tabulated", interpolation, reducedVelocity: converted.reducedVelocity };
    for (const name of ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const) table[name] = converted[name];
    const next = gridFromTable(table);
    setRows(next);
    setRowNotes([]);
    setImportMessage(null);
    emitTable(next, interpolation, []);
  }

  // The plots follow the table after a pause in typing (eight subplots take a noticeable moment to redraw), and
  // are keyed by content: the form hands over a fresh copy of the block on every keystroke anywhere in the study.
  const plotted: StudyAerodynamics | null =
    value.model !== "tabulated" ? value : gridParse.ok ? { model: "tabulated", interpolation, ...gridParse.table } : null;
  const plottedKey = useDebouncedValue(JSON.stringify(plotted), 350);
  const figure = useMemo(() => {
    const settled = JSON.parse(plottedKey) as StudyAerodynamics | null;
    try {
      return settled ? aeroFigure(settled) : null;
    } catch {
      return null;
    }
  }, [plottedKey]);

  return (
    <div className="space-y-3">
      <fieldset>
        <legend className="mb-1 text-sm font-semibold text-ink-800">Model</legend>
        <div className="grid grid-cols-2 gap-1 rounded-md bg-ink-50 p-1 sm:grid-cols-4" role="radiogroup" aria-label="Aerodynamic model">
          {CHOICES.map((option) => {
            const checked = choice === option.value;
            return (
              <label
                key={option.value}
                className={cn(
                  "cursor-pointer rounded-sm px-2 py-1 text-center text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-tide-600",
                  checked ? "bg-surface font-semibold text-ink-950 shadow-panel" : "text-ink-700 hover:bg-ink-100",
                  readOnly && !checked && "opacity-60",
                )}
                title={option.hint}
              >
                <input
                  type="radio"
                  name={`${groupId}-model`}
                  value={option.value}
                  checked={checked}
                  disabled={readOnly}
                  onChange={() => choose(option.value)}
                  className="sr-only"
                />
                {option.label}
              </label>
            );
          })}
        </div>
      </fieldset>

      {choice === "quasi-steady" && value.model === "quasi-steady" ? (
        <QuasiSteadyFields value={value} readOnly={readOnly} onChange={(next) => onChange(next, [])}
          staticSets={staticSets} />
      ) : null}
      {datasetsError ? (
        <p className="text-sm text-signal-700">The alternative's data sets could not be loaded ({datasetsError}); reload to pick one.</p>
      ) : null}
      {choice === "dataset" ? (
        <DatasetPicker sets={derivativeSets} active={activeSet} readOnly={readOnly} onPick={copyDataset} />
      ) : null}
      {choice === "flat-plate" ? (
        <p className="text-sm text-ink-700">
          Theodorsen's thin plate in the study convention (no inputs). Bluff decks usually flutter lower: use it as a
          first estimate until section-model derivatives exist.
        </p>
      ) : null}

      {choice === "tabulated" ? (
        <div className="space-y-2">
          {!readOnly ? (
            <div className="flex flex-wrap items-end gap-2 text-sm">
              <SelectField label="Interpolation" value={interpolation}
                onChange={(v) => { setInterpolation(v as typeof interpolation); emitTable(rows, v as typeof interpolation); }}
                options={[["monotone-cubic", "Monotone cubic"], ["linear", "Linear"]]} />
            </div>
          ) : (
            <p className="text-sm text-ink-700">Interpolation: {interpolation === "linear" ? "linear" : "monotone cubic"}</p>
          )}
          {!readOnly ? (
            <fieldset className="rounded-md border border-ink-200 px-2 pt-1 pb-2">
              <legend className="px-1 text-xs font-semibold text-ink-700">CSV import — the file's convention</legend>
              <div className="flex flex-wrap items-end gap-2 text-sm">
                <SelectField label="Abscissa" value={convention.abscissa}
                  onChange={(v) => setConvention({ ...convention, abscissa: v as DerivativeConvention["abscissa"] })}
                  options={[["Ur", "Ur = U/(fB)"], ["Ur-half", "U/(fb), b = B/2"], ["K", "K = Bω/U"], ["k-half", "k = bω/U"]]} />
                <SelectField label="Forces on" value={convention.normalisation}
                  onChange={(v) => setConvention({ ...convention, normalisation: v as DerivativeConvention["normalisation"] })}
                  options={[["B", "B, B² (ours)"], ["2B", "2B, 2B² (half of ours)"]]} />
                <SelectField label="Heave and lift" value={convention.sign}
                  onChange={(v) => setConvention({ ...convention, sign: v as DerivativeConvention["sign"] })}
                  options={[["h-down", "Downward (ours)"], ["h-up", "Upward"]]} />
                <input ref={fileInput} type="file" accept=".csv,text/csv,text/plain" className="sr-only" tabIndex={-1}
                  aria-label="Derivative CSV file" onChange={onFile} data-testid="derivative-csv-input" />
                <Button variant="secondary" size="sm" onClick={() => fileInput.current?.click()}>Upload CSV…</Button>
                <Button variant="ghost" size="sm" onClick={() => editRows([...rows, emptyRow()])}>Add row</Button>
              </div>
              <p className="mt-1 text-xs text-ink-600">
                Header row: abscissa, then any of H1…H4, A1…A4. Or paste a block from a spreadsheet into a cell.
              </p>
            </fieldset>
          ) : null}
          {importMessage ? (
            <p role="status" className={cn("text-sm", importMessage.tone === "error" ? "font-semibold text-signal-700" : "text-ink-700")}>
              {importMessage.text}
            </p>
          ) : null}
          <DerivativeTable rows={rows} errors={shownErrors} readOnly={readOnly} onChange={editRows} />
        </div>
      ) : null}

      <div>
        <p className="text-xs text-ink-600">
          Derivatives vs Ur as the engine interpolates them{value.model === "tabulated" ? "; tested range shaded, held end values dotted" : ""}.
        </p>
        {figure ? (
          <Plot {...figure} height={250} label="Flutter derivatives H1* to A4* against reduced velocity" />
        ) : (
          <p className="flex h-[250px] items-center justify-center rounded-md bg-ink-50 text-sm text-ink-600">
            The plots return when the table reads cleanly.
          </p>
        )}
      </div>
    </div>
  );
}

