import { useState } from "react";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { Button } from "@/components/ui/button";
import { useProjectReviewers } from "@/features/review/api/get-project-reviewers";
import { useReassignReviewer } from "@/features/review/api/reassign-reviewer";
import { ReviewerSelect } from "@/features/review/components/reviewer-select";

/**
 * An administrator hands a revision in review to another reviewer of the project: only the assigned reviewer may
 * sign or return it, so this is how a decision moves when the assigned one is away. Audited on the server.
 */
export function ReassignForm({ review, projectId }: { review: RevisionReviewDto; projectId: string }) {
  const reviewers = useProjectReviewers(projectId);
  const reassign = useReassignReviewer(review.revisionId);
  const [reviewerId, setReviewerId] = useState("");
  const options = (reviewers.data ?? []).filter((r) => r.userId !== review.author?.id && r.userId !== review.request?.reviewer.id);
  const chosen = reviewerId || options[0]?.userId || "";
  return (
    <form
      className="space-y-2 rounded-md border border-ink-100 px-3 py-2"
      aria-label="Reassign the review"
      onSubmit={(e) => {
        e.preventDefault();
        if (chosen) reassign.mutate({ reviewerId: chosen }, { onSuccess: () => setReviewerId("") });
      }}
    >
      <p className="text-sm text-ink-700">
        Assigned to {review.request?.reviewer.name}. As an administrator you can hand the review to another reviewer of the project.
      </p>
      <ReviewerSelect
        id={`reassign-${review.revisionId}`}
        label="New reviewer"
        options={options}
        isLoading={reviewers.isPending}
        value={chosen}
        onChange={setReviewerId}
      />
      <Button type="submit" variant="secondary" size="sm" isLoading={reassign.isPending} disabled={!chosen}>
        Reassign the review
      </Button>
      {reassign.isError ? (
        <p role="alert" className="text-sm font-semibold text-signal-700">
          {reassign.error.message}
        </p>
      ) : null}
    </form>
  );
}
