import { cn } from "@/lib/cn";
import { SOURCE_STATUS_LABEL, sourceStatus } from "@/features/criteria/utils/source-status";

/**
 * A small mark beside a basis or source that was recalled rather than checked ("from memory"), or that is a
 * rule of the trade rather than a code clause ("common practice").
 */
export function SourceBadge({ text, className }: { text: string; className?: string }) {
  const status = sourceStatus(text);
  if (status === null) return null;
  return (
    <span
      className={cn(
        "inline-flex items-center rounded-sm px-1.5 py-px align-[0.1em] text-xs font-semibold whitespace-nowrap",
        status === "from-memory" ? "bg-caution-100 text-caution-700" : "bg-ink-100 text-ink-700",
        className,
      )}
      title={
        status === "from-memory"
          ? "Recalled, not checked against the standard's text: verify the clause and value before relying on it."
          : undefined
      }
    >
      {SOURCE_STATUS_LABEL[status]}
    </span>
  );
}

/** A list of source texts, each with its mark. */
export function SourceList({ sources, className }: { sources: readonly string[]; className?: string }) {
  const unique = [...new Set(sources)];
  return (
    <ul className={cn("list-disc space-y-1 pl-5 text-sm text-ink-700", className)}>
      {unique.map((source) => (
        <li key={source}>
          {source} <SourceBadge text={source} />
        </li>
      ))}
    </ul>
  );
}
