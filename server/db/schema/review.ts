import { sql } from "drizzle-orm";
import { bigserial, check, index, integer, jsonb, pgEnum, pgTable, serial, text, timestamp, unique } from "drizzle-orm/pg-core";
import type { SummaryPayload } from "../../../shared/schemas/summary.js";
import { REVIEW_EVENT_KINDS, REVIEW_REQUEST_STATES } from "../../../shared/schemas/review.js";
import { revisionAssessments } from "./assessments.js";
import { studyRevisions } from "./study-revisions.js";
import { users } from "./users.js";

/**
 * Review of study revisions. Revision rows are immutable, so the review lives beside them: a revision without a
 * review request is a draft; its request is `in-review` (assigned to one reviewer of the project), then
 * `returned` (with comments; it may be submitted again) or `signed` (final). One request per revision.
 */
export const reviewRequestState = pgEnum("review_request_state", REVIEW_REQUEST_STATES);

export const reviewRequests = pgTable(
  "review_requests",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => studyRevisions.id),
    state: reviewRequestState("state").notNull().default("in-review"),
    requestedBy: integer("requested_by")
      .notNull()
      .references(() => users.id),
    reviewerId: integer("reviewer_id")
      .notNull()
      .references(() => users.id),
    /** The analyst's note to the reviewer at the latest submission. */
    note: text("note").notNull().default(""),
    submittedAt: timestamp("submitted_at", { withTimezone: true }).notNull().defaultNow(),
    /** When it was last returned or signed; null while in review. */
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    decidedBy: integer("decided_by").references(() => users.id),
  },
  (t) => [
    unique("review_requests_revision_key").on(t.revisionId),
    index("review_requests_reviewer_state_idx").on(t.reviewerId, t.state),
    check("review_requests_decided", sql`(${t.state} = 'in-review') = (${t.decidedAt} is null)`),
  ],
);

export const reviewEventKind = pgEnum("review_event_kind", REVIEW_EVENT_KINDS);

/**
 * The history of a revision's review (submitted, returned, signed, commented, reassigned), oldest first.
 * Append-only: a trigger (drizzle/0011) refuses UPDATE, DELETE and TRUNCATE, as on review_comments (and on signatures, 0006).
 */
export const reviewEvents = pgTable(
  "review_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => studyRevisions.id),
    kind: reviewEventKind("kind").notNull(),
    actorId: integer("actor_id").references(() => users.id),
    /** Reviewer named at submission, when kind = submitted. */
    reviewerId: integer("reviewer_id").references(() => users.id),
    note: text("note").notNull().default(""),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("review_events_revision_idx").on(t.revisionId, t.id)],
);

/** Reviewers' (and analysts' replies) comments on a revision, shown in the workspace beside the revision. Append-only (drizzle/0011). */
export const reviewComments = pgTable(
  "review_comments",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => studyRevisions.id),
    authorId: integer("author_id")
      .notNull()
      .references(() => users.id),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("review_comments_revision_idx").on(t.revisionId, t.id),
    check("review_comments_body", sql`length(trim(${t.body})) > 0`),
  ],
);

/**
 * Signed stability summaries: the compact JWS, the key id that signed it, the payload as signed and the SHA-256
 * of its canonical JSON, and the stored assessment it states. A revision is signed at most once (unique
 * revision_id). The summary's id is this row's.
 * Append-only (trigger in drizzle/0006).
 */
export const signatures = pgTable(
  "signatures",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => studyRevisions.id),
    signerId: integer("signer_id")
      .notNull()
      .references(() => users.id),
    jws: text("jws").notNull(),
    kid: text("kid").notNull(),
    payload: jsonb("payload").$type<SummaryPayload>().notNull(),
    payloadSha256: text("payload_sha256").notNull(),
    signedAt: timestamp("signed_at", { withTimezone: true }).notNull(),
    /** The assessment the summary states (summary format 2 on); null for summaries signed before assessments were stored. */
    assessmentId: integer("assessment_id").references(() => revisionAssessments.id),
  },
  (t) => [
    unique("signatures_revision_key").on(t.revisionId),
    check("signatures_sha256_hex", sql`${t.payloadSha256} ~ '^[0-9a-f]{64}$'`),
  ],
);

export type ReviewRequest = typeof reviewRequests.$inferSelect;
export type ReviewEvent = typeof reviewEvents.$inferSelect;
export type ReviewComment = typeof reviewComments.$inferSelect;
export type Signature = typeof signatures.$inferSelect;
