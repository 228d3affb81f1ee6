import { Link } from "react-router-dom";
import { unconfirmedBasesMessage } from "@shared/criteria/basis-confirmation";
import type { Phenomenon } from "@shared/schemas/criteria";
import type { SummaryPreviewDto } from "@shared/schemas/review";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { paths } from "@/config/paths";
import { ReviewDecisionForm } from "@/features/review/components/review-decision-form";
import { ReviewStateBadge } from "@/features/review/components/review-state-badge";

/**
 * The head of a summary preview: what is being read (not signed yet, exactly what will be signed), the revision's
 * review state, and what stands in the way of signing — criteria whose basis no reviewer confirmed, a newer revision.
 */
export function SummaryPreviewHead({ preview }: { preview: SummaryPreviewDto }) {
  const p = preview.payload;
  const n = preview.revisionNumber;
  return (
    <>
      <PageHeader
        eyebrow={
          <>
            <Link className="underline-offset-2 hover:underline" to={paths.app.reviews.getHref()}>
              Review queue
            </Link>{" "}
            · {p.project.name} · {p.alternative.name} ·{" "}
            <Link className="underline-offset-2 hover:underline" to={paths.app.study.getHref(preview.projectId, preview.studyId, n)}>
              Open revision {n} in the workspace
            </Link>
          </>
        }
        title={`Summary to sign — ${p.study.name}, revision ${n}`}
        description={
          <span className="inline-flex flex-wrap items-center gap-x-2">
            <ReviewStateBadge state={preview.state} />
            {preview.state === "in-review" && preview.reviewer ? `with ${preview.reviewer.name}` : null}
            <span>· criteria version {preview.criteriaVersion}</span>
          </span>
        }
      />
      <div role="note" aria-label="Not signed yet" className="rounded-lg border-2 border-tide-600 bg-tide-50 px-4 py-3 text-ink-900">
        <p className="font-semibold">Not signed yet — this is the summary exactly as it will be signed.</p>
        <p className="text-sm">
          The server built it from the stored revision and the project's current criteria, with the same builder as the
          signature. Signing adds only your statement and the time; if anything else changes before you sign, the signature is
          refused and you read the new summary first. Preview hash <span className="num break-all">{preview.previewSha256}</span>.
        </p>
      </div>
      {preview.unconfirmedBases.length > 0 ? (
        <div role="alert" className="rounded-lg border-2 border-caution-400 bg-caution-100 px-4 py-3 text-caution-700">
          <p className="font-semibold">Criteria not confirmed: this summary cannot be signed yet.</p>
          <p className="text-sm">
            {unconfirmedBasesMessage(preview.unconfirmedBases, preview.criteriaVersion)}{" "}
            <Link className="font-semibold underline" to={paths.app.project.getHref(preview.projectId)}>
              Open the project's criteria
            </Link>
          </p>
        </div>
      ) : null}
      {preview.latestNumber > n ? (
        <p role="note" className="rounded-md bg-caution-100 px-3 py-1.5 text-sm text-caution-700">
          Revision {preview.latestNumber} of this study already exists; this summary covers revision {n}.
        </p>
      ) : null}
    </>
  );
}

/** Where a signed summary has its statement, the preview has the decision: sign with a statement, or return. */
export function SummaryPreviewDecision({ preview, onOutdated, onSigned }: {
  preview: SummaryPreviewDto;
  onOutdated: () => void;
  onSigned: (summaryId: string) => void;
}) {
  const n = preview.revisionNumber;
  if (preview.state !== "in-review") {
    return (
      <Card title="Decision">
        <p className="text-ink-800">
          {preview.state === "returned"
            ? `Revision ${n} was returned to the analyst; it is signed only after it is submitted for review again.`
            : `Revision ${n} is a draft: the analyst submits it for review before it can be signed.`}
        </p>
      </Card>
    );
  }
  if (!preview.canDecide) {
    return (
      <Card title="Decision">
        <p className="text-ink-800">{preview.signBlocker}</p>
      </Card>
    );
  }
  return (
    <Card title="Your decision" subtitle="Sign the summary above with your statement, or return the revision to the analyst with comments" aria-label="Your decision">
      <ReviewDecisionForm
        revisionId={preview.revisionId}
        revisionNumber={n}
        previewSha256={preview.previewSha256}
        signBlocker={preview.signBlocker}
        onOutdated={onOutdated}
        onSigned={onSigned}
      />
    </Card>
  );
}

/** After the signature: the preview is gone (the revision is signed); the signed summary is what to read now. */
export function SignedNotice({ studyName, revisionNumber, summaryId }: { studyName: string; revisionNumber: number; summaryId: string }) {
  return (
    <p role="status" className="rounded-md border border-steady-100 bg-steady-100 px-3 py-2 text-steady-700">
      {studyName}: revision {revisionNumber} is signed with your statement.{" "}
      <Link className="font-semibold underline" to={paths.app.summary.getHref(summaryId)}>
        Open the signed summary
      </Link>
    </p>
  );
}

/** Beside each criterion of the preview whose basis no reviewer confirmed: what it still is. */
export function UnconfirmedCriterionNote({ preview, phenomenon }: { preview: SummaryPreviewDto; phenomenon: Phenomenon }) {
  const open = preview.unconfirmedBases.find((u) => u.phenomenon === phenomenon);
  if (!open) return null;
  return (
    <span className="rounded-sm bg-caution-100 px-1.5 py-px text-xs font-semibold whitespace-nowrap text-caution-700" data-testid={`unconfirmed-${phenomenon}`}>
      {open.defaultText ? "Default text — not confirmed" : "Not confirmed"}
    </span>
  );
}
