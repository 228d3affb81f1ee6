import { aliasedTable, and, asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import {
  alternatives,
  memberships,
  projects,
  reviewComments,
  reviewEvents,
  reviewRequests,
  studies,
  studyRevisions,
  users,
  type ReviewEvent,
} from "../schema/index.js";

const requester = aliasedTable(users, "requester");
const reviewer = aliasedTable(users, "reviewer");
const author = aliasedTable(users, "author");

/** The revision's review request with the names of the people on it, locked for the transaction when `lock`. */
export async function findReviewRequest(db: DbOrTx, revisionId: number, lock = false) {
  const base = db
    .select({
      id: reviewRequests.id,
      state: reviewRequests.state,
      note: reviewRequests.note,
      submittedAt: reviewRequests.submittedAt,
      decidedAt: reviewRequests.decidedAt,
      requestedById: reviewRequests.requestedBy,
      reviewerId: reviewRequests.reviewerId,
    })
    .from(reviewRequests)
    .where(eq(reviewRequests.revisionId, revisionId));
  const [row] = lock ? await base.for("update") : await base;
  return row;
}

/** A review request row as `findReviewRequest` reads it. */
export type ReviewRequestRow = NonNullable<Awaited<ReturnType<typeof findReviewRequest>>>;

/** First submission: inserts the request; a concurrent first submission hits the unique key (23505). */
export async function insertReviewRequest(
  db: DbOrTx,
  values: { revisionId: number; requestedBy: number; reviewerId: number; note: string; submittedAt?: Date },
): Promise<void> {
  await db.insert(reviewRequests).values(values);
}

/** Submission again after a return: back in review with the (possibly new) reviewer and note. */
export async function resubmitReviewRequest(
  db: DbOrTx,
  id: number,
  values: { requestedBy: number; reviewerId: number; note: string },
): Promise<void> {
  await db
    .update(reviewRequests)
    .set({ ...values, state: "in-review", submittedAt: new Date(), decidedAt: null, decidedBy: null })
    .where(eq(reviewRequests.id, id));
}

/** Hands a request in review to another reviewer (the caller has locked it and checked its state). */
export async function reassignReviewRequest(db: DbOrTx, id: number, reviewerId: number): Promise<void> {
  await db.update(reviewRequests).set({ reviewerId }).where(eq(reviewRequests.id, id));
}

export async function decideReviewRequest(
  db: DbOrTx,
  id: number,
  state: "returned" | "signed",
  decidedBy: number,
  at: Date,
): Promise<void> {
  await db.update(reviewRequests).set({ state, decidedAt: at, decidedBy }).where(eq(reviewRequests.id, id));
}

export async function insertReviewEvent(
  db: DbOrTx,
  event: Pick<ReviewEvent, "revisionId" | "kind" | "actorId"> & Partial<Pick<ReviewEvent, "reviewerId" | "note" | "at">>,
): Promise<void> {
  await db.insert(reviewEvents).values(event);
}

export async function listReviewEvents(db: DbOrTx, revisionId: number) {
  return db
    .select({
      kind: reviewEvents.kind,
      note: reviewEvents.note,
      at: reviewEvents.at,
      actorId: reviewEvents.actorId,
      actorName: author.name,
      reviewerId: reviewEvents.reviewerId,
      reviewerName: reviewer.name,
    })
    .from(reviewEvents)
    .leftJoin(author, eq(author.id, reviewEvents.actorId))
    .leftJoin(reviewer, eq(reviewer.id, reviewEvents.reviewerId))
    .where(eq(reviewEvents.revisionId, revisionId))
    .orderBy(asc(reviewEvents.id));
}

export async function insertReviewComment(
  db: DbOrTx,
  values: { revisionId: number; authorId: number; body: string },
): Promise<{ id: number; createdAt: Date }> {
  const [row] = await db
    .insert(reviewComments)
    .values(values)
    .returning({ id: reviewComments.id, createdAt: reviewComments.createdAt });
  return row;
}

/** Comments of a revision, oldest first, with the author's role in the revision's project. */
export async function listReviewComments(db: DbOrTx, revisionId: number, projectId: number) {
  return db
    .select({
      id: reviewComments.id,
      body: reviewComments.body,
      createdAt: reviewComments.createdAt,
      authorId: reviewComments.authorId,
      authorName: users.name,
      authorRole: memberships.role,
    })
    .from(reviewComments)
    .innerJoin(users, eq(users.id, reviewComments.authorId))
    .leftJoin(memberships, and(eq(memberships.userId, reviewComments.authorId), eq(memberships.projectId, projectId)))
    .where(eq(reviewComments.revisionId, revisionId))
    .orderBy(asc(reviewComments.id));
}

/** Names of the people on a review request. */
export async function reviewPeople(db: DbOrTx, requestId: number) {
  const [row] = await db
    .select({ requesterName: requester.name, reviewerName: reviewer.name })
    .from(reviewRequests)
    .innerJoin(requester, eq(requester.id, reviewRequests.requestedBy))
    .innerJoin(reviewer, eq(reviewer.id, reviewRequests.reviewerId))
    .where(eq(reviewRequests.id, requestId));
  return row;
}

/** Revisions in review assigned to the reviewer, oldest submission first. */
export async function listReviewQueue(db: DbOrTx, reviewerId: number) {
  return db
    .select({
      revisionId: studyRevisions.id,
      revisionNumber: studyRevisions.number,
      latestNumber: sql<number>`(select max(r2.number)::int from ${studyRevisions} r2 where r2.study_id = ${studyRevisions.studyId})`,
      studyId: studies.id,
      studyName: studies.name,
      alternativeName: alternatives.name,
      projectId: projects.id,
      projectName: projects.name,
      authorId: studyRevisions.authorId,
      authorName: sql<string | null>`(select u.name from ${users} u where u.id = ${studyRevisions.authorId})`,
      requestedById: reviewRequests.requestedBy,
      requestedByName: sql<string>`(select u.name from ${users} u where u.id = ${reviewRequests.requestedBy})`,
      note: reviewRequests.note,
      submittedAt: reviewRequests.submittedAt,
      changeNote: studyRevisions.changeNote,
      engineVersion: studyRevisions.engineVersion,
      documentSha256: studyRevisions.documentSha256,
    })
    .from(reviewRequests)
    .innerJoin(studyRevisions, eq(studyRevisions.id, reviewRequests.revisionId))
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .innerJoin(projects, eq(projects.id, alternatives.projectId))
    // Only while the reviewer still holds the reviewer role on the project.
    .innerJoin(
      memberships,
      and(eq(memberships.projectId, projects.id), eq(memberships.userId, reviewerId), eq(memberships.role, "reviewer")),
    )
    .where(and(eq(reviewRequests.reviewerId, reviewerId), eq(reviewRequests.state, "in-review")))
    .orderBy(asc(reviewRequests.submittedAt), asc(reviewRequests.id));
}


/**
 * Every revision of one study, or of every study of a project, oldest first, with its review request's state and
 * reviewer (none: a draft), the study's newest revision number and the number of its latest signed revision.
 */
export async function listRevisionReviewStates(db: DbOrTx, scope: { studyId: number } | { projectId: number }) {
  return db
    .select({
      revisionId: studyRevisions.id,
      studyId: studyRevisions.studyId,
      number: studyRevisions.number,
      state: reviewRequests.state,
      reviewerId: reviewRequests.reviewerId,
      reviewerName: reviewer.name,
      decidedAt: reviewRequests.decidedAt,
      latestNumber: sql<number>`(select max(r2.number)::int from ${studyRevisions} r2 where r2.study_id = ${studyRevisions.studyId})`,
      latestSignedNumber: sql<number | null>`(
        select max(r3.number)::int from ${studyRevisions} r3
        join ${reviewRequests} q3 on q3.revision_id = r3.id and q3.state = 'signed'
        where r3.study_id = ${studyRevisions.studyId})`,
    })
    .from(studyRevisions)
    .innerJoin(studies, eq(studies.id, studyRevisions.studyId))
    .innerJoin(alternatives, eq(alternatives.id, studies.alternativeId))
    .leftJoin(reviewRequests, eq(reviewRequests.revisionId, studyRevisions.id))
    .leftJoin(reviewer, eq(reviewer.id, reviewRequests.reviewerId))
    .where("studyId" in scope ? eq(studyRevisions.studyId, scope.studyId) : eq(alternatives.projectId, scope.projectId))
    .orderBy(asc(studyRevisions.studyId), asc(studyRevisions.number));
}
