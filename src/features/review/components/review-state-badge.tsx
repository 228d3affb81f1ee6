import type { ReviewState, RevisionReviewStatusDto } from "@shared/schemas/review";
import { cn } from "@/lib/cn";

type Look = "draft" | "in-review" | "returned" | "signed" | "superseded";

const TONE: Record<Look, string> = {
  draft: "border-ink-200 bg-ink-50 text-ink-700",
  "in-review": "border-caution-100 bg-caution-100 text-caution-700",
  returned: "border-signal-100 bg-signal-50 text-signal-700",
  signed: "border-steady-100 bg-steady-100 text-steady-700",
  superseded: "border-ink-200 bg-white text-ink-600",
};

const LABEL: Record<Look, string> = {
  draft: "Draft",
  "in-review": "In review",
  returned: "Returned",
  signed: "Signed",
  superseded: "Superseded",
};

function Badge({ look, className }: { look: Look; className?: string }) {
  return (
    <span className={cn("inline-flex items-center rounded-sm border px-1.5 text-xs leading-5 font-semibold whitespace-nowrap", TONE[look], className)}>
      {LABEL[look]}
    </span>
  );
}

/** The review state of a revision as a small label. */
export function ReviewStateBadge({ state, className }: { state: ReviewState; className?: string }) {
  return <Badge look={state} className={className} />;
}

/**
 * The words beside the badge: with whom a revision is in review, who returned or signed it, and what superseded
 * it (a newer revision for a draft or a returned one; a later signature for a signed one).
 */
export function reviewStatusWords(status: RevisionReviewStatusDto): { look: Look; detail: string } {
  const who = status.reviewer?.name ?? "a former reviewer";
  const by = status.supersededBy;
  switch (status.state) {
    case "draft":
      return by === null ? { look: "draft", detail: "not submitted" } : { look: "superseded", detail: `draft; r${by} is newer` };
    case "in-review":
      return { look: "in-review", detail: `with ${who}` };
    case "returned":
      return by === null ? { look: "returned", detail: `by ${who}` } : { look: "superseded", detail: `returned by ${who}; r${by} is newer` };
    case "signed":
      return by === null ? { look: "signed", detail: `by ${who}` } : { look: "superseded", detail: `signed by ${who}; r${by} signed since` };
  }
}

/** A revision's review state: badge and words ("In review with Mira Holloway"), readable as one phrase. */
export function ReviewStatusLine({ status, className }: { status: RevisionReviewStatusDto; className?: string }) {
  const { look, detail } = reviewStatusWords(status);
  return (
    <span className={cn("inline-flex flex-wrap items-center gap-x-1.5 text-sm", className)} data-testid={`review-state-r${status.number}`}>
      <Badge look={look} />{" "}
      <span className="text-ink-700">{detail}</span>
    </span>
  );
}
