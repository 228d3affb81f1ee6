/**
 * The review workflow of study revisions: submit (analyst names a reviewer of the project), return with
 * comments or sign (reviewers only, never the revision's author), comments, the reviewer's queue. Every write
 * and its audit event share one transaction; e-mail goes out after the commit and never undoes the action.
 */
import type {
  ReviewQueueItemDto,
  RevisionReviewDto,
  SubmitReviewInput,
} from "../../shared/schemas/review.js";
import { submitReviewSchema } from "../../shared/schemas/review.js";
import type { AppContext } from "../app-context.js";
import type { Db, DbOrTx } from "../db/client.js";
import { isUniqueViolation } from "../db/pg-errors.js";
import { writeAudit } from "../db/queries/audit.js";
import { findMembershipRole } from "../db/queries/projects.js";
import {
  decideReviewRequest,
  findReviewRequest,
  insertReviewComment,
  insertReviewEvent,
  insertReviewRequest,
  listReviewComments,
  listReviewEvents,
  listReviewQueue,
  resubmitReviewRequest,
  reviewPeople,
  type ReviewRequestRow,
} from "../db/queries/review.js";
import { findLatestRevision, findRevision, type RevisionRow } from "../db/queries/revisions.js";
import { findSignatureOfRevision } from "../db/queries/signatures.js";
import { findUserById } from "../db/queries/users.js";
import { AppError } from "../errors.js";
import { verificationCode } from "../signing/verification-code.js";
import { assertRole, person } from "./access.js";
import { currentAssessments, toAssessmentDto } from "./assessments.js";
import type { SessionUser } from "./auth.js";
import { notifyReturned, notifyReviewRequested } from "./review-mail.js";

/** The revision, after checking the caller holds one of `roles` in its project (404 / 403 otherwise). */
async function revisionFor(
  db: DbOrTx,
  user: SessionUser,
  revisionId: number,
  roles: readonly ("analyst" | "reviewer" | "viewer")[],
): Promise<RevisionRow> {
  const revision = await findRevision(db, revisionId);
  if (!revision) throw AppError.notFound("Revision");
  await assertRole(db, user, revision.projectId, roles);
  return revision;
}

/** Signing and returning need the reviewer role itself: an administrator who is not a reviewer may not. */
export async function assertReviewer(db: DbOrTx, user: SessionUser, revision: RevisionRow, what: string): Promise<void> {
  const role = await findMembershipRole(db, user.id, revision.projectId);
  if (role !== "reviewer") {
    throw AppError.forbidden(`Only a reviewer of this project can ${what}; your role is ${role ?? (user.isAdmin ? "administrator (not a reviewer)" : "none")}.`);
  }
  if (revision.authorId === user.id) {
    throw AppError.forbidden(`You are the author of revision ${revision.number}: nobody may ${what} their own revision.`);
  }
}

/**
 * Inside the decision's transaction, on the locked request: only the reviewer the revision is assigned to may sign
 * or return it — another reviewer of the project may read and comment, not decide. An administrator reassigns.
 */
export function assertAssignedReviewer(
  request: Pick<ReviewRequestRow, "reviewerId">,
  user: SessionUser,
  revision: Pick<RevisionRow, "number">,
  what: string,
): void {
  if (request.reviewerId !== user.id) {
    throw AppError.forbidden(
      `Revision ${revision.number} is assigned to another reviewer: only they can ${what}. An administrator can reassign the review.`,
    );
  }
}

/**
 * GET /api/revisions/:id/review — state, request, comments, history and signature (analysts and reviewers).
 * Takes the pool, not a transaction: its reads run side by side on separate connections.
 */
export async function getRevisionReview(db: Db, user: SessionUser, revisionId: number): Promise<RevisionReviewDto> {
  const revision = await revisionFor(db, user, revisionId, ["analyst", "reviewer"]);
  const [request, comments, events, signature] = await Promise.all([
    findReviewRequest(db, revisionId),
    listReviewComments(db, revisionId, revision.projectId),
    listReviewEvents(db, revisionId),
    findSignatureOfRevision(db, revisionId),
  ]);
  const people = request ? await reviewPeople(db, request.id) : undefined;
  return {
    revisionId: String(revision.id),
    revisionNumber: revision.number,
    latestNumber: revision.latestNumber,
    studyId: String(revision.studyId),
    projectId: String(revision.projectId),
    author: person(revision.authorId, revision.authorName),
    state: request?.state ?? "draft",
    request:
      request && people
        ? {
            reviewer: { id: String(request.reviewerId), name: people.reviewerName },
            requestedBy: { id: String(request.requestedById), name: people.requesterName },
            note: request.note,
            submittedAt: request.submittedAt.toISOString(),
            decidedAt: request.decidedAt?.toISOString() ?? null,
          }
        : null,
    comments: comments.map((c) => ({
      id: String(c.id),
      author: { id: String(c.authorId), name: c.authorName, role: c.authorRole },
      body: c.body,
      createdAt: c.createdAt.toISOString(),
    })),
    events: events.map((e) => ({
      kind: e.kind,
      actor: person(e.actorId, e.actorName),
      reviewer: person(e.reviewerId, e.reviewerName),
      note: e.note,
      at: e.at.toISOString(),
    })),
    signature: signature
      ? {
          summaryId: String(signature.id),
          signer: { id: String(signature.signerId), name: signature.signerName },
          signedAt: signature.signedAt.toISOString(),
          kid: signature.kid,
          verificationCode: verificationCode(signature.jws),
        }
      : null,
  };
}

/** 400 on `reviewerId` unless the user is a reviewer of the revision's project and not its author. */
export async function assertEligibleReviewer(
  db: DbOrTx,
  reviewerId: number,
  revision: Pick<RevisionRow, "projectId" | "authorId">,
): Promise<void> {
  if ((await findMembershipRole(db, reviewerId, revision.projectId)) !== "reviewer") {
    throw AppError.badRequest(`User ${reviewerId} is not a reviewer of this project: name one of its reviewers.`, { path: "reviewerId" });
  }
  if (reviewerId === revision.authorId) {
    throw AppError.badRequest("The reviewer cannot be the revision's author.", { path: "reviewerId" });
  }
}

/** POST /api/revisions/:id/submit — an analyst sends a draft (or a returned revision) to a reviewer of the project. */
export async function submitForReview(
  ctx: AppContext,
  user: SessionUser,
  revisionId: number,
  body: SubmitReviewInput,
  ip?: string,
): Promise<RevisionReviewDto> {
  const input = submitReviewSchema.parse(body);
  const { db } = ctx;
  const revision = await revisionFor(db, user, revisionId, ["analyst"]);
  await assertEligibleReviewer(db, input.reviewerId, revision);
  try {
    await db.transaction((tx) =>
      recordSubmission(tx, { revision, analystId: user.id, reviewerId: input.reviewerId, note: input.note, ip }),
    );
  } catch (err) {
    if (isUniqueViolation(err)) throw AppError.conflict(`Revision ${revision.number} was submitted by someone else at the same moment.`);
    throw err;
  }
  const reviewer = await findUserById(db, input.reviewerId);
  if (reviewer) notifyReviewRequested(ctx, { revision, reviewer, analystName: user.name, note: input.note });
  return getRevisionReview(db, user, revisionId);
}

/** POST /api/revisions/:id/return — a reviewer sends the revision back with comments (stored as a comment too). */
export async function returnRevision(
  ctx: AppContext,
  user: SessionUser,
  revisionId: number,
  comments: string,
  ip?: string,
): Promise<RevisionReviewDto> {
  const { db } = ctx;
  const revision = await revisionFor(db, user, revisionId, ["reviewer"]);
  await assertReviewer(db, user, revision, "return a revision");
  const now = new Date();
  const requestedBy = await db.transaction(async (tx) => {
    const request = await findReviewRequest(tx, revisionId, true);
    if (!request) throw AppError.conflict(`Revision ${revision.number} has not been submitted for review.`);
    if (request.state !== "in-review") throw AppError.conflict(`Revision ${revision.number} is ${request.state}, not in review.`);
    assertAssignedReviewer(request, user, revision, "return it");
    await decideReviewRequest(tx, request.id, "returned", user.id, now);
    await insertReviewComment(tx, { revisionId, authorId: user.id, body: comments });
    await insertReviewEvent(tx, { revisionId, kind: "returned", actorId: user.id, note: comments, at: now });
    await writeAudit(tx, { actorId: user.id, action: "review.return", objectType: "revision", objectId: revisionId, ip });
    return request.requestedById;
  });
  const analyst = await findUserById(db, requestedBy);
  if (analyst) notifyReturned(ctx, { revision, analyst, reviewerName: user.name, comments });
  return getRevisionReview(db, user, revisionId);
}

/** POST /api/revisions/:id/comments — analysts and reviewers of the project comment on a revision. */
export async function addComment(
  db: Db,
  user: SessionUser,
  revisionId: number,
  body: string,
  ip?: string,
): Promise<RevisionReviewDto> {
  await revisionFor(db, user, revisionId, ["analyst", "reviewer"]);
  await db.transaction((tx) => recordComment(tx, { revisionId, authorId: user.id, body, ip }));
  return getRevisionReview(db, user, revisionId);
}

/**
 * Inside the caller's transaction: puts the revision in review (a new request, or the returned one again) with
 * its history entry and audit event. Used by the submit route and by the demo seed (`at`: when it happened).
 * A returned revision that a newer revision of its study supersedes is not submitted again (409
 * `superseded`): the newer revision is what answers the reviewer's comments.
 */
export async function recordSubmission(
  tx: DbOrTx,
  m: { revision: Pick<RevisionRow, "id" | "number" | "studyId">; analystId: number; reviewerId: number; note: string; ip?: string; at?: Date },
): Promise<void> {
  const revisionId = m.revision.id;
  const existing = await findReviewRequest(tx, revisionId, true);
  if (existing?.state === "in-review") throw AppError.conflict(`Revision ${m.revision.number} is already in review.`);
  if (existing?.state === "signed") throw AppError.conflict(`Revision ${m.revision.number} is signed; it cannot be submitted again.`);
  if (existing?.state === "returned") {
    const latest = await findLatestRevision(tx, m.revision.studyId);
    if (latest && latest.number > m.revision.number) {
      throw new AppError(
        409,
        "superseded",
        `Revision ${m.revision.number} was returned and revision ${latest.number} supersedes it: submit revision ${latest.number} instead.`,
        { details: { latestNumber: latest.number, latestRevisionId: String(latest.id) } },
      );
    }
  }
  const values = { requestedBy: m.analystId, reviewerId: m.reviewerId, note: m.note };
  if (existing) await resubmitReviewRequest(tx, existing.id, values);
  else await insertReviewRequest(tx, { revisionId, ...values, submittedAt: m.at });
  await insertReviewEvent(tx, { revisionId, kind: "submitted", actorId: m.analystId, reviewerId: m.reviewerId, note: m.note, at: m.at });
  await writeAudit(tx, {
    actorId: m.analystId,
    action: "review.submit",
    objectType: "revision",
    objectId: revisionId,
    ip: m.ip,
    details: { reviewerId: m.reviewerId, resubmission: Boolean(existing) },
  });
}

/** Inside the caller's transaction: a comment on a revision, its history entry and its audit event. */
export async function recordComment(
  tx: DbOrTx,
  m: { revisionId: number; authorId: number; body: string; ip?: string },
): Promise<void> {
  const { id } = await insertReviewComment(tx, { revisionId: m.revisionId, authorId: m.authorId, body: m.body });
  await insertReviewEvent(tx, { revisionId: m.revisionId, kind: "commented", actorId: m.authorId });
  await writeAudit(tx, { actorId: m.authorId, action: "review.comment", objectType: "revision", objectId: m.revisionId, ip: m.ip, details: { commentId: id } });
}

/** GET /api/review-queue — revisions in review assigned to the caller. */
export async function reviewQueue(db: DbOrTx, user: SessionUser): Promise<ReviewQueueItemDto[]> {
  const rows = await listReviewQueue(db, user.id);
  // Each revision's current assessment: the same figures, margins and warning count as the study and the comparison.
  const assessments = await currentAssessments(db, rows.map((r) => ({ id: r.revisionId, projectId: r.projectId, engineVersion: r.engineVersion })), user.id);
  return rows.map((r) => ({
    revisionId: String(r.revisionId),
    revisionNumber: r.revisionNumber,
    latestNumber: r.latestNumber,
    studyId: String(r.studyId),
    studyName: r.studyName,
    alternativeName: r.alternativeName,
    projectId: String(r.projectId),
    projectName: r.projectName,
    author: person(r.authorId, r.authorName),
    requestedBy: { id: String(r.requestedById), name: r.requestedByName },
    note: r.note,
    submittedAt: r.submittedAt.toISOString(),
    changeNote: r.changeNote,
    assessment: toAssessmentDto(assessments.get(r.revisionId)!),
    engineVersion: r.engineVersion,
    documentSha256: r.documentSha256,
  }));
}

export { revisionFor };
