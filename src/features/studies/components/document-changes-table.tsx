import type { JsonChange } from "@shared/diff-json";
import { fieldLabel, formatValue } from "@/features/studies/utils/format-value";

interface DocumentChangesTableProps {
  changes: readonly JsonChange[];
  /** Column heading of the values before ("r4") and after ("r5", "file"). */
  fromLabel: string;
  toLabel: string;
  /** Accessible name of the table. */
  label: string;
}

/** Field by field, each change of a study document: the engineer's name of the field, its JSON path, before and after. */
export function DocumentChangesTable({ changes, fromLabel, toLabel, label }: DocumentChangesTableProps) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm" aria-label={label}>
        <thead>
          <tr className="border-y border-ink-200 bg-ink-50 text-xs tracking-wide text-ink-600 uppercase">
            <th scope="col" className="px-4 py-1.5 font-semibold">Field</th>
            <th scope="col" className="px-2 py-1.5 font-semibold normal-case">{fromLabel}</th>
            <th scope="col" className="px-2 py-1.5 font-semibold normal-case">{toLabel}</th>
          </tr>
        </thead>
        <tbody>
          {changes.map((change) => (
            <tr key={change.path} className="border-b border-ink-100 align-top">
              <th scope="row" className="px-4 py-1 font-normal">
                <span className="block text-ink-900">{fieldLabel(change.path)}</span>
                <span className="font-mono text-xs text-ink-600">{change.path}</span>
              </th>
              <td className="num px-2 py-1 break-all text-ink-700">{change.kind === "added" ? "—" : formatValue(change.old)}</td>
              <td className="num px-2 py-1 font-semibold break-all text-ink-950">{change.kind === "removed" ? "—" : formatValue(change.new)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
