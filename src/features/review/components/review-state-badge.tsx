import type { ReviewState } from "@shared/schemas/review";
import { cn } from "@/lib/cn";

const LOOK: Record<ReviewState, { label: string; tone: string }> = {
  draft: { label: "Draft", tone: "border-ink-200 bg-ink-50 text-ink-700" },
  "in-review": { label: "In review", tone: "border-caution-100 bg-caution-100 text-caution-700" },
  returned: { label: "Returned", tone: "border-signal-100 bg-signal-50 text-signal-700" },
  signed: { label: "Signed", tone: "border-steady-100 bg-steady-100 text-steady-700" },
};

/** The review state of a revision as a small label. */
export function ReviewStateBadge({ state, className }: { state: ReviewState; className?: string }) {
  const look = LOOK[state];
  return (
    <span className={cn("inline-flex items-center rounded-sm border px-1.5 text-xs leading-5 font-semibold", look.tone, className)}>
      {look.label}
    </span>
  );
}
