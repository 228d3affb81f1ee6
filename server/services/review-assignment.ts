/**
 * Reassigning a review: an administrator hands a revision in review to another reviewer of its project (the
 * assigned one is away, or conflicted). Only the assigned reviewer may sign or return a revision, so this is the
 * one way to move a decision to someone else. Audited as `review.reassign`, kept in the history as `reassigned`,
 * and the new reviewer is e-mailed like a new request.
 */
import type { ReassignReviewInput, RevisionReviewDto } from "../../shared/schemas/review.js";
import { reassignReviewSchema } from "../../shared/schemas/review.js";
import type { AppContext } from "../app-context.js";
import { writeAudit } from "../db/queries/audit.js";
import { findReviewRequest, insertReviewEvent, reassignReviewRequest } from "../db/queries/review.js";
import { findRevision } from "../db/queries/revisions.js";
import { findUserById } from "../db/queries/users.js";
import { AppError } from "../errors.js";
import type { SessionUser } from "./auth.js";
import { assertEligibleReviewer, getRevisionReview } from "./review.js";
import { notifyReviewRequested } from "./review-mail.js";

/** POST /api/revisions/:id/reviewer (administrators; the route checks the flag). */
export async function reassignReviewer(
  ctx: AppContext,
  admin: SessionUser,
  revisionId: number,
  body: ReassignReviewInput,
  ip?: string,
): Promise<RevisionReviewDto> {
  if (!admin.isAdmin) throw AppError.forbidden("Only an administrator can reassign a review.");
  const input = reassignReviewSchema.parse(body);
  const { db } = ctx;
  const revision = await findRevision(db, revisionId);
  if (!revision) throw AppError.notFound("Revision");
  await assertEligibleReviewer(db, input.reviewerId, revision);
  const request = await db.transaction(async (tx) => {
    const current = await findReviewRequest(tx, revisionId, true);
    if (!current || current.state !== "in-review") {
      throw AppError.conflict(
        `Revision ${revision.number} is ${current ? current.state : "a draft"}: only a revision in review can be reassigned.`,
      );
    }
    if (current.reviewerId === input.reviewerId) {
      throw AppError.conflict(`Revision ${revision.number} is already assigned to user ${input.reviewerId}.`);
    }
    await reassignReviewRequest(tx, current.id, input.reviewerId);
    await insertReviewEvent(tx, { revisionId, kind: "reassigned", actorId: admin.id, reviewerId: input.reviewerId, note: input.note });
    await writeAudit(tx, {
      actorId: admin.id,
      action: "review.reassign",
      objectType: "revision",
      objectId: revisionId,
      ip,
      details: { fromReviewerId: current.reviewerId, toReviewerId: input.reviewerId },
    });
    return current;
  });
  const [reviewer, requester] = await Promise.all([findUserById(db, input.reviewerId), findUserById(db, request.requestedById)]);
  if (reviewer) {
    notifyReviewRequested(ctx, { revision, reviewer, analystName: requester?.name ?? admin.name, note: input.note || request.note });
  }
  return getRevisionReview(db, admin, revisionId);
}
