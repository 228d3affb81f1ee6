/**
 * The review state of every revision of a study or project, for the study header, the revision timeline and the
 * project's studies table: draft, in review with whom, returned, signed — and superseded (shared/schemas/review.ts,
 * `RevisionReviewStatusDto`). Analysts and reviewers read them, like the revisions themselves.
 */
import type { RevisionReviewStatusDto } from "../../shared/schemas/review.js";
import type { DbOrTx } from "../db/client.js";
import { listRevisionReviewStates } from "../db/queries/review.js";
import { findStudy } from "../db/queries/studies.js";
import { assertRole, loadWithAccess, person, READ_ROLES } from "./access.js";
import type { SessionUser } from "./auth.js";

type Row = Awaited<ReturnType<typeof listRevisionReviewStates>>[number];

function supersededBy(row: Row): number | null {
  switch (row.state) {
    case "signed":
      return row.latestSignedNumber !== null && row.latestSignedNumber > row.number ? row.latestSignedNumber : null;
    case "in-review":
      return null; // still waits for its reviewer's decision
    default:
      return row.latestNumber > row.number ? row.latestNumber : null;
  }
}

const toStatus = (row: Row): RevisionReviewStatusDto => ({
  revisionId: String(row.revisionId),
  studyId: String(row.studyId),
  number: row.number,
  state: row.state ?? "draft",
  reviewer: person(row.reviewerId, row.reviewerName),
  decidedAt: row.decidedAt?.toISOString() ?? null,
  supersededBy: supersededBy(row),
});

/** GET /api/studies/:id/review-states — every revision of the study, oldest first. */
export async function studyReviewStates(db: DbOrTx, user: SessionUser, studyId: number): Promise<RevisionReviewStatusDto[]> {
  await loadWithAccess(db, user, "Study", () => findStudy(db, studyId), "read");
  return (await listRevisionReviewStates(db, { studyId })).map(toStatus);
}

/** GET /api/projects/:projectId/review-states — every revision of every study of the project. */
export async function projectReviewStates(db: DbOrTx, user: SessionUser, projectId: number): Promise<RevisionReviewStatusDto[]> {
  await assertRole(db, user, projectId, READ_ROLES);
  return (await listRevisionReviewStates(db, { projectId })).map(toStatus);
}
