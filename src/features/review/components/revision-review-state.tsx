import { Link } from "react-router-dom";
import { paths } from "@/config/paths";
import { useProjectReviewStates, useStudyReviewStates } from "@/features/review/api/get-review-states";
import { ReviewStatusLine } from "@/features/review/components/review-state-badge";

/** The review state of one revision of a study (study header, revision timeline). */
export function RevisionReviewState({ studyId, revisionId }: { studyId: string; revisionId: string }) {
  const states = useStudyReviewStates(studyId);
  if (states.isPending) return <span className="text-sm text-ink-600">review state…</span>;
  if (states.isError) return <span className="text-sm text-signal-700">review state not loaded: {states.error.message}</span>;
  const status = states.data.find((s) => s.revisionId === revisionId);
  return status ? <ReviewStatusLine status={status} /> : null;
}

/**
 * The review state of a study's newest revision for the project's studies table, and the study's current signed
 * revision when that is an older one.
 */
export function StudyLatestReviewState({ projectId, studyId }: { projectId: string; studyId: string }) {
  const states = useProjectReviewStates(projectId);
  if (states.isPending) return <span className="text-ink-600">…</span>;
  if (states.isError) return <span className="text-signal-700" title={states.error.message}>not loaded</span>;
  const ofStudy = states.data.filter((s) => s.studyId === studyId);
  const latest = ofStudy.at(-1);
  if (!latest) return <span className="text-ink-600">—</span>;
  const signed = ofStudy.find((s) => s.state === "signed" && s.supersededBy === null);
  return (
    <span className="inline-flex flex-wrap items-center gap-x-1.5">
      <ReviewStatusLine status={latest} />
      {signed && signed.number !== latest.number ? (
        <Link to={paths.app.study.getHref(projectId, studyId, signed.number)} className="text-sm text-steady-700 hover:underline">
          r{signed.number} signed
        </Link>
      ) : null}
    </span>
  );
}
