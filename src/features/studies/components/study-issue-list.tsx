import type { StudyIssue } from "@shared/schemas/study";
import { fieldLabel } from "@/features/studies/utils/format-value";

/** The problems of a study document, each once, by the field's name and its JSON path (the first ten). */
export function StudyIssueList({ issues }: { issues: readonly StudyIssue[] }) {
  return (
    <ul className="list-disc pl-5 font-normal text-ink-900">
      {issues.slice(0, 10).map((d, i) => (
        <li key={i}>
          {fieldLabel(d.path)}: {d.message} <code className="text-xs text-ink-600">{d.path}</code>
        </li>
      ))}
      {issues.length > 10 ? <li>… and {issues.length - 10} more</li> : null}
    </ul>
  );
}

/** The study-format problems a 400 of the import or re-run lists in its details (JSON paths starting at `$`). */
export function issuesOf(error: unknown): StudyIssue[] {
  if (!(error instanceof Object) || !("details" in error) || !Array.isArray(error.details)) return [];
  return (error.details as Array<{ path?: unknown; message?: unknown }>).flatMap((d) =>
    typeof d?.path === "string" && d.path.startsWith("$") ? [{ path: d.path, message: String(d.message ?? "") }] : [],
  );
}
