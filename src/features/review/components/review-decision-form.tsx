import { useRef, useState } from "react";
import { Link } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { TextAreaField } from "@/components/ui/textarea-field";
import { paths } from "@/config/paths";
import { ApiError } from "@/lib/api-client";
import { useReturnRevision } from "@/features/review/api/return-revision";
import { useSignRevision } from "@/features/review/api/sign-revision";

/**
 * A reviewer's decision on one revision, below its summary preview: sign the stability summary with a statement, or
 * return it with comments. Both texts are required by the server; the form says so before sending. The signature
 * carries the hash of the preview shown above it, so the server signs exactly that or refuses.
 */
export function ReviewDecisionForm({
  revisionId,
  revisionNumber,
  previewSha256,
  signBlocker,
  onOutdated,
  onSigned,
}: {
  revisionId: string;
  revisionNumber: number;
  /** Hash of the summary preview on the page (sent with the signature). */
  previewSha256: string;
  /** Why signing is not possible now (unconfirmed criteria, not assigned, not in review); null when it is. */
  signBlocker: string | null;
  /** The server found the summary changed since the preview was loaded: load it again. */
  onOutdated: () => void;
  /** Called with the new summary's id once signed (the page then leaves the preview, which no longer exists). */
  onSigned?: (summaryId: string) => void;
}) {
  const [statement, setStatement] = useState("");
  const [comments, setComments] = useState("");
  // A missing text is told on its own field (aria-describedby); the server's refusal below both forms.
  const [statementError, setStatementError] = useState<string | undefined>();
  const [commentsError, setCommentsError] = useState<string | undefined>();
  const [problem, setProblem] = useState<string | null>(null);
  const statementRef = useRef<HTMLTextAreaElement>(null);
  const commentsRef = useRef<HTMLTextAreaElement>(null);
  const sign = useSignRevision(revisionId);
  const ret = useReturnRevision(revisionId);
  const busy = sign.isPending || ret.isPending;

  if (sign.isSuccess) {
    return (
      <p role="status" className="rounded-md border border-steady-100 bg-steady-100 px-3 py-2 text-steady-700">
        Revision {revisionNumber} is signed.{" "}
        <Link className="font-semibold underline" to={paths.app.summary.getHref(sign.data.summaryId)}>
          Open the signed summary
        </Link>
      </p>
    );
  }
  if (ret.isSuccess) {
    return (
      <p role="status" className="rounded-md border border-ink-200 bg-ink-50 px-3 py-2 text-ink-700">
        Revision {revisionNumber} was returned to the analyst with your comments.
      </p>
    );
  }

  const clear = () => {
    setProblem(null);
    setStatementError(undefined);
    setCommentsError(undefined);
  };
  const onSign = () => {
    clear();
    if (!statement.trim()) {
      setStatementError("Write your statement before signing: it is signed with the summary.");
      statementRef.current?.focus();
      return;
    }
    sign.mutate(
      { statement, previewSha256 },
      {
        onError: (e) => {
          setProblem(e.message);
          if (e instanceof ApiError && e.code === "preview_outdated") onOutdated();
        },
        onSuccess: (data) => onSigned?.(data.summaryId),
      },
    );
  };
  const onReturn = () => {
    clear();
    if (!comments.trim()) {
      setCommentsError("Write what the analyst should change before returning the revision.");
      commentsRef.current?.focus();
      return;
    }
    ret.mutate({ comments }, { onError: (e) => setProblem(e.message) });
  };

  return (
    <div className="grid gap-4 md:grid-cols-2">
      <div className="space-y-2">
        <TextAreaField
          label="Reviewer's statement"
          hint="Signed with the summary above, word for word; the owner's representative reads it."
          rows={4}
          maxLength={4000}
          ref={statementRef}
          error={statementError}
          value={statement}
          disabled={signBlocker !== null}
          onChange={(e) => setStatement(e.target.value)}
        />
        <Button variant="accent" onClick={onSign} isLoading={sign.isPending} disabled={busy || signBlocker !== null}>
          Sign the summary
        </Button>
        {signBlocker ? (
          <p className="text-sm font-semibold text-caution-700" data-testid="sign-blocker">
            Cannot be signed now: {signBlocker}
          </p>
        ) : null}
      </div>
      <div className="space-y-2">
        <TextAreaField
          label="Comments for the analyst"
          hint="Returned unsigned; the analyst addresses them in a new revision."
          rows={4}
          maxLength={8000}
          ref={commentsRef}
          error={commentsError}
          value={comments}
          onChange={(e) => setComments(e.target.value)}
        />
        <Button variant="secondary" onClick={onReturn} isLoading={ret.isPending} disabled={busy}>
          Return with comments
        </Button>
      </div>
      {problem ? (
        <p role="alert" className="text-sm font-semibold text-signal-700 md:col-span-2">
          {problem}
        </p>
      ) : null}
    </div>
  );
}
