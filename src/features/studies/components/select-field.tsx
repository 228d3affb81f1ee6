import { useId } from "react";

/** A compact labelled select for option rows (interpolation, conventions, data sets). */
export function SelectField({ label, value, options, onChange }: {
  label: string; value: string; options: ReadonlyArray<readonly [string, string]>; onChange: (value: string) => void;
}) {
  const id = useId();
  return (
    <div className="space-y-0.5">
      <label htmlFor={id} className="block text-xs font-semibold text-ink-700">{label}</label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)}
        className="h-7 rounded-md border border-ink-300 bg-white px-1.5 text-sm hover:border-ink-400">
        {options.map(([v, text]) => <option key={v} value={v}>{text}</option>)}
      </select>
    </div>
  );
}
