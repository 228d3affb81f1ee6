import type { ProjectMember } from "@shared/schemas/projects";

interface ReviewerSelectProps {
  id: string;
  label: string;
  /** The project's reviewers who may take the review (the author and, when reassigning, the current one left out). */
  options: ProjectMember[];
  isLoading: boolean;
  value: string;
  onChange: (userId: string) => void;
}

/** A choice among the project's reviewers, for submitting a revision and for reassigning its review. */
export function ReviewerSelect({ id, label, options, isLoading, value, onChange }: ReviewerSelectProps) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold text-ink-800">
        {label}
      </label>
      <select
        id={id}
        className="block h-9 w-full rounded-md border border-ink-300 bg-white px-2 text-[0.95rem]"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        disabled={options.length === 0}
      >
        {options.length === 0 ? (
          <option value="">{isLoading ? "Loading the project's reviewers…" : "No other reviewer on this project"}</option>
        ) : null}
        {options.map((r) => (
          <option key={r.userId} value={r.userId}>
            {r.name}
          </option>
        ))}
      </select>
    </div>
  );
}
