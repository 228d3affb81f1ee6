import { cn } from "@/lib/cn";

const SIZES = { sm: "size-4", md: "size-5", lg: "size-8" } as const;

interface SpinnerProps {
  size?: keyof typeof SIZES;
  /** Read by screen readers; pass null when a surrounding element already announces the wait. */
  label?: string | null;
  className?: string;
}

export function Spinner({ size = "md", label = "Loading", className }: SpinnerProps) {
  return (
    <span role={label ? "status" : undefined} className={cn("inline-flex items-center", className)}>
      <svg className={cn("animate-spin text-current", SIZES[size])} viewBox="0 0 24 24" fill="none" aria-hidden="true">
        <circle cx="12" cy="12" r="9" stroke="currentColor" strokeOpacity="0.25" strokeWidth="3" />
        <path d="M21 12a9 9 0 0 0-9-9" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
      </svg>
      {label ? <span className="sr-only">{label}</span> : null}
    </span>
  );
}

/** A panel-sized waiting state that keeps the space the content will take. */
export function LoadingBlock({ label, className }: { label: string; className?: string }) {
  return (
    <div
      role="status"
      className={cn("flex min-h-32 items-center justify-center gap-2 text-sm text-ink-600", className)}
    >
      <Spinner size="sm" label={null} />
      <span>{label}</span>
    </div>
  );
}
