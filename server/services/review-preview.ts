/**
 * The summary preview a reviewer reads and signs from: the payload the server would sign for the revision now,
 * built by the signature's own builder (summaryPayloadOfRevision), with the hash the sign request must carry back
 * (review-sign-checks.ts). Analysts and reviewers of the project read it; only the assigned reviewer signs.
 */
import type { SummaryPreviewDto } from "../../shared/schemas/review.js";
import type { Db } from "../db/client.js";
import { findCurrentCriteria, type CriteriaVersionRow } from "../db/queries/criteria.js";
import { findReviewRequest, type ReviewRequestRow } from "../db/queries/review.js";
import type { RevisionRow } from "../db/queries/revisions.js";
import { findSignatureOfRevision } from "../db/queries/signatures.js";
import { findUserById } from "../db/queries/users.js";
import { AppError } from "../errors.js";
import { person } from "./access.js";
import type { SessionUser } from "./auth.js";
import { assertAssignedReviewer, assertReviewer, revisionFor } from "./review.js";
import { assertBasesConfirmed, previewSha256, unconfirmedBasesOf } from "./review-sign-checks.js";
import { summaryBranches } from "./summaries.js";
import { summaryPayloadOfRevision } from "./summary-payload.js";

/**
 * Why `user` cannot decide on the revision now — not its assigned reviewer, its author, or not in review — with the
 * same checks, in the same order, as the sign and return requests; null when they can. Only the sentence of an
 * expected refusal is kept; anything else is a fault and propagates.
 */
async function decisionBlocker(
  db: Db,
  user: SessionUser,
  revision: RevisionRow,
  request: ReviewRequestRow | undefined,
): Promise<string | null> {
  try {
    await assertReviewer(db, user, revision, "sign a revision");
    if (!request || request.state !== "in-review") {
      return `Revision ${revision.number} is ${request ? request.state : "a draft"}: only a revision in review can be signed.`;
    }
    assertAssignedReviewer(request, user, revision, "sign it");
    return null;
  } catch (err) {
    if (err instanceof AppError && err.status === 403) return err.message;
    throw err;
  }
}

/** The refusal of unconfirmed criteria bases, as the sign request words it, or null. */
function criteriaBlocker(criteria: CriteriaVersionRow): string | null {
  try {
    assertBasesConfirmed(criteria);
    return null;
  } catch (err) {
    if (err instanceof AppError) return err.message;
    throw err;
  }
}

/**
 * GET /api/revisions/:id/summary-preview. 409 when the revision is already signed (its signed summary is named in
 * the details) or when the project has no criteria yet (a summary states margins against them).
 */
export async function getSummaryPreview(db: Db, user: SessionUser, revisionId: number): Promise<SummaryPreviewDto> {
  const revision = await revisionFor(db, user, revisionId, ["analyst", "reviewer"]);
  const [request, signature, criteria] = await Promise.all([
    findReviewRequest(db, revisionId),
    findSignatureOfRevision(db, revisionId),
    findCurrentCriteria(db, revision.projectId),
  ]);
  if (signature) {
    throw AppError.conflict(`Revision ${revision.number} is already signed: read its signed summary.`, { summaryId: String(signature.id) });
  }
  if (!criteria) {
    throw AppError.conflict(
      "The project has no design wind and criteria yet: the summary states the required speeds and margins, so a reviewer or administrator must save the criteria first.",
    );
  }
  // The summary names its signer: the assigned reviewer once there is one, else the reader.
  const signer = request ? await findUserById(db, request.reviewerId) : undefined;
  const { payload } = await summaryPayloadOfRevision(db, revision.id, signer ?? { id: user.id, name: user.name, email: user.email }, { statement: "" });
  const decision = await decisionBlocker(db, user, revision, request);
  return {
    revisionId: String(revision.id),
    revisionNumber: revision.number,
    latestNumber: revision.latestNumber,
    studyId: String(revision.studyId),
    projectId: String(revision.projectId),
    state: request?.state ?? "draft",
    reviewer: signer ? person(signer.id, signer.name) : null,
    payload,
    previewSha256: previewSha256(payload),
    criteriaVersion: criteria.version,
    unconfirmedBases: unconfirmedBasesOf(criteria),
    canDecide: decision === null,
    signBlocker: decision ?? criteriaBlocker(criteria),
    branches: summaryBranches(revision.result),
    branchSampling: revision.result.sampling ?? null,
  };
}
