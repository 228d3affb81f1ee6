import { useState } from "react";
import { Link } from "react-router-dom";
import type { RevisionReviewDto } from "@shared/schemas/review";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadingBlock } from "@/components/ui/spinner";
import { TextAreaField } from "@/components/ui/textarea-field";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { formatDateTime } from "@/lib/format";
import { useAddComment } from "@/features/review/api/add-comment";
import { useRevisionReview } from "@/features/review/api/get-revision-review";
import { useProjectReviewers } from "@/features/review/api/get-project-reviewers";
import { useSubmitRevision } from "@/features/review/api/submit-revision";
import { ReassignForm } from "@/features/review/components/reassign-form";
import { ReviewerSelect } from "@/features/review/components/reviewer-select";
import { ReviewStateBadge } from "@/features/review/components/review-state-badge";

export interface ReviewPanelProps {
  revisionId: string;
  projectId: string;
  /** The signed-in user's id and role in the project (null for an administrator who is not a member). */
  userId: string;
  role: "analyst" | "reviewer" | "viewer" | null;
  isAdmin?: boolean;
}

function SubmitForm({ review, projectId }: { review: RevisionReviewDto; projectId: string }) {
  const reviewers = useProjectReviewers(projectId);
  const submit = useSubmitRevision(review.revisionId);
  const [reviewerId, setReviewerId] = useState("");
  const [note, setNote] = useState("");
  const options = (reviewers.data ?? []).filter((r) => r.userId !== review.author?.id);
  const chosen = reviewerId || review.request?.reviewer.id || options[0]?.userId || "";
  return (
    <form
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (chosen) submit.mutate({ reviewerId: chosen, note });
      }}
    >
      <ReviewerSelect
        id={`reviewer-${review.revisionId}`}
        label="Reviewer"
        options={options}
        isLoading={reviewers.isPending}
        value={chosen}
        onChange={setReviewerId}
      />
      <TextAreaField label="Note to the reviewer (optional)" rows={2} maxLength={4000} value={note} onChange={(e) => setNote(e.target.value)} />
      <Button type="submit" variant="accent" size="sm" isLoading={submit.isPending} disabled={!chosen}>
        {review.state === "returned" ? "Submit again for review" : "Submit for review"}
      </Button>
      {submit.isError ? (
        <p role="alert" className="text-sm font-semibold text-signal-700">
          {submit.error.message}
        </p>
      ) : null}
    </form>
  );
}

function CommentForm({ revisionId }: { revisionId: string }) {
  const add = useAddComment(revisionId);
  const [body, setBody] = useState("");
  return (
    <form
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (body.trim()) add.mutate({ body }, { onSuccess: () => setBody("") });
      }}
    >
      <TextAreaField label="Add a comment" rows={2} maxLength={8000} value={body} onChange={(e) => setBody(e.target.value)} />
      <Button type="submit" variant="secondary" size="sm" isLoading={add.isPending} disabled={!body.trim()}>
        Comment
      </Button>
      {add.isError ? (
        <p role="alert" className="text-sm font-semibold text-signal-700">
          {add.error.message}
        </p>
      ) : null}
    </form>
  );
}

/**
 * The review of one revision, for the workspace: its state, who reviews it, the comments, and the actions the
 * caller's role allows (analysts submit; the assigned reviewer opens the summary preview to sign or return it;
 * administrators reassign). Self-contained: it loads its
 * own data and can be mounted beside any revision.
 */
export function ReviewPanel({ revisionId, projectId, userId, role, isAdmin = false }: ReviewPanelProps) {
  const query = useRevisionReview(revisionId);
  if (query.isPending) return <LoadingBlock label="Loading the review…" />;
  if (query.isError) {
    return (
      <ErrorPanel
        title="The review could not be loaded"
        message={query.error.message}
        code={query.error instanceof ApiError ? query.error.code : undefined}
        onRetry={() => void query.refetch()}
        isRetrying={query.isFetching}
      />
    );
  }
  const review = query.data;
  // A returned revision that a newer one supersedes is answered by the newer one, not submitted again.
  const supersededReturn = review.state === "returned" && review.latestNumber > review.revisionNumber;
  const canSubmit =
    (role === "analyst" || (isAdmin && role === null)) && (review.state === "draft" || (review.state === "returned" && !supersededReturn));
  const inReview = review.state === "in-review";
  // Only the assigned reviewer decides; another reviewer of the project reads and comments.
  const assignedToMe = review.request?.reviewer.id === userId;
  const canDecide = role === "reviewer" && inReview && assignedToMe && review.author?.id !== userId;

  return (
    <Card
      title={
        <span className="flex items-center gap-2">
          Review of revision {review.revisionNumber} <ReviewStateBadge state={review.state} />
        </span>
      }
      subtitle={
        review.request
          ? `Reviewer: ${review.request.reviewer.name} · submitted by ${review.request.requestedBy.name}, ${formatDateTime(review.request.submittedAt)}`
          : "Not submitted for review"
      }
      aria-label={`Review of revision ${review.revisionNumber}`}
    >
      <div className="space-y-4">
        {review.signature ? (
          <p className="rounded-md border border-steady-100 bg-steady-100 px-3 py-2 text-steady-700">
            Signed by {review.signature.signer.name} on {formatDateTime(review.signature.signedAt)} · code{" "}
            <span className="num">{review.signature.verificationCode}</span> ·{" "}
            <Link className="font-semibold underline" to={paths.app.summary.getHref(review.signature.summaryId)}>
              Signed summary
            </Link>
          </p>
        ) : null}
        {review.request?.note ? (
          <blockquote className="border-l-3 border-tide-600 pl-3 text-ink-800">{review.request.note}</blockquote>
        ) : null}
        <section aria-label="Comments">
          <h3 className="mb-1 text-sm font-semibold text-ink-800">Comments ({review.comments.length})</h3>
          {review.comments.length === 0 ? (
            <p className="text-sm text-ink-600">No comments yet.</p>
          ) : (
            <ol className="space-y-2">
              {review.comments.map((c) => (
                <li key={c.id} className="rounded-md border border-ink-100 bg-white px-3 py-2">
                  <p className="text-xs text-ink-600">
                    <span className="font-semibold text-ink-800">{c.author.name}</span>
                    {c.author.role ? ` (${c.author.role})` : ""} · <time dateTime={c.createdAt}>{formatDateTime(c.createdAt)}</time>
                  </p>
                  <p className="whitespace-pre-wrap text-ink-900">{c.body}</p>
                </li>
              ))}
            </ol>
          )}
        </section>
        {canDecide ? (
          <p className="rounded-md border border-tide-600 bg-tide-50 px-3 py-2 text-ink-900">
            You review this revision. Read its stability summary as it will be signed, then sign it or return it with comments:{" "}
            <Link className="font-semibold text-tide-700 underline" to={paths.app.summaryPreview.getHref(revisionId)}>
              Read the summary to sign or return
            </Link>
          </p>
        ) : null}
        {supersededReturn ? (
          <p className="rounded-md bg-ink-100 px-3 py-2 text-sm text-ink-800">
            Returned, and revision {review.latestNumber} supersedes it: revision {review.revisionNumber} is not submitted again. Submit
            revision {review.latestNumber} from its page.
          </p>
        ) : null}
        {role === "reviewer" && inReview && !assignedToMe ? (
          <p className="text-sm text-ink-700">
            This revision is assigned to {review.request?.reviewer.name}: only they can sign or return it. An administrator can reassign the review.
          </p>
        ) : null}
        {isAdmin && inReview ? <ReassignForm review={review} projectId={projectId} /> : null}
        {canSubmit ? <SubmitForm review={review} projectId={projectId} /> : null}
        {role === "analyst" || role === "reviewer" ? <CommentForm revisionId={revisionId} /> : null}
      </div>
    </Card>
  );
}
