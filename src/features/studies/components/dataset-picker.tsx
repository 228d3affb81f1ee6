import type { DatasetDto } from "@shared/schemas/datasets";
import type { StudyAerodynamics } from "@shared/schemas/study";
import { SelectField } from "@/features/studies/components/select-field";

export type DerivativeSet = DatasetDto & { converted: { reducedVelocity: number[] } & Record<"H1" | "H2" | "H3" | "H4" | "A1" | "A2" | "A3" | "A4", number[]> };

export const isDerivativeSet = (d: DatasetDto): d is DerivativeSet => d.kind === "flutter-derivatives" && "reducedVelocity" in d.converted;

/** The data set whose converted table the block holds, if any (the study format stores the numbers, not a link). */
export function matchingDataset(value: StudyAerodynamics, sets: readonly DerivativeSet[]): DerivativeSet | null {
  if (value.model !== "tabulated") return null;
  const zeros = value.reducedVelocity.map(() => 0);
  const same = (a: readonly number[] | undefined, b: readonly number[]) => {
    const column = a ?? zeros;
    return column.length === b.length && b.every((x, i) => column[i] === x);
  };
  return sets.find((d) => same(value.reducedVelocity, d.converted.reducedVelocity) &&
    (["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const).every((n) => same(value[n], d.converted[n]))) ?? null;
}


/** Picks one of the alternative's flutter-derivative data sets and shows where its numbers come from. */
export function DatasetPicker({ sets, active, readOnly, onPick }: {
  sets: readonly DerivativeSet[]; active: DerivativeSet | null; readOnly: boolean; onPick: (id: string) => void;
}) {
  if (sets.length === 0) {
    return <p className="text-sm text-caution-700">This alternative has no flutter-derivative data set yet. Upload one on the project page, or type your own table.</p>;
  }
  return (
    <div className="space-y-2">
      {readOnly ? null : (
        <SelectField label="Data set" value={active?.id ?? ""} onChange={onPick}
          options={[...(active ? [] : [["", "Choose…"] as [string, string]]), ...sets.map((d) => [d.id, d.name] as [string, string])]} />
      )}
      {active ? (
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="text-ink-600">Set</dt><dd className="font-semibold">{active.name}</dd>
          <dt className="text-ink-600">Tested</dt>
          <dd className="num">Ur {active.testedRange.min}–{active.testedRange.max} · {active.provenance.flow} flow{active.provenance.facility ? ` · ${active.provenance.facility}` : ""}{active.provenance.modelScale ? ` · 1:${active.provenance.modelScale}` : ""}</dd>
          <dt className="text-ink-600">Delivered as</dt>
          <dd>{active.convention ? `${active.convention.abscissa}, forces on ${active.convention.normalisation}, heave ${active.convention.sign === "h-down" ? "down" : "up"}` : "—"}; converted to the study convention</dd>
          <dt className="text-ink-600">File</dt><dd className="truncate font-mono text-xs leading-5" title={active.file.sha256}>{active.file.name}</dd>
        </dl>
      ) : (
        <p className="text-sm text-ink-700">The study's table differs from every data set; pick one to copy its derivatives in.</p>
      )}
      {active?.warnings.length ? (
        <ul className="text-sm text-caution-700">{active.warnings.map((w, i) => <li key={i}>{w.column ? `${w.column}: ` : ""}{w.message}</li>)}</ul>
      ) : null}
    </div>
  );
}
