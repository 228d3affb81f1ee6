/**
 * Contract of the review workflow (`/api/revisions/:id/{submit,return,sign,comments,review}`, `/api/review-queue`)
 * and of the signed summaries (`/api/summaries`). A revision is a draft until it is submitted; its review is then
 * `in-review`, and ends `returned` (with comments; it may be submitted again) or `signed` (final).
 */
import { z } from "zod";
import { userText } from "./input-rules";
import type { SweepSampling } from "./result";
import type { StoredAssessmentDto } from "./assessment";
import type { SignedSummaryPayload } from "./summary";

export const REVIEW_REQUEST_STATES = ["in-review", "returned", "signed"] as const;
export const REVIEW_STATES = ["draft", ...REVIEW_REQUEST_STATES] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const REVIEW_EVENT_KINDS = ["submitted", "returned", "signed", "commented", "reassigned"] as const;
export type ReviewEventKind = (typeof REVIEW_EVENT_KINDS)[number];

const text = (max: number) =>
  userText({ error: "must be a string" })
    .trim()
    .min(1, "must not be blank")
    .max(max, `must have at most ${max} characters`);

const userId = z
  .union([z.string().regex(/^\d{1,9}$/, "must be a user id"), z.number().int().positive()])
  .transform(Number)
  .describe("Id of a reviewer of the revision's project");

/** POST /api/revisions/:id/submit (analysts). */
export const submitReviewSchema = z.strictObject({
  reviewerId: userId,
  note: userText().trim().max(4000, "must have at most 4000 characters").default(""),
});
export type SubmitReviewInput = z.input<typeof submitReviewSchema>;

/**
 * POST /api/revisions/:id/reviewer (administrators): hands a revision in review to another reviewer of the project,
 * e.g. when the assigned one is away. Only the assigned reviewer may sign or return a revision.
 */
export const reassignReviewSchema = z.strictObject({
  reviewerId: userId,
  note: z.string().trim().max(4000, "must have at most 4000 characters").default(""),
});
export type ReassignReviewInput = z.input<typeof reassignReviewSchema>;

/** POST /api/revisions/:id/return (reviewers): the comments are required — they say what to change. */
export const returnReviewSchema = z.strictObject({ comments: text(8000) });

/** POST /api/revisions/:id/sign (reviewers): the reviewer's statement, signed with the summary. */
export const signReviewSchema = z.strictObject({ statement: text(4000) });

/** POST /api/revisions/:id/comments (analysts and reviewers of the project). */
export const createCommentSchema = z.strictObject({ body: text(8000) });

export interface PersonDto {
  id: string;
  name: string;
}

export interface ReviewCommentDto {
  id: string;
  author: PersonDto & { role: string | null };
  body: string;
  createdAt: string;
}

export interface ReviewEventDto {
  kind: ReviewEventKind;
  actor: PersonDto | null;
  reviewer: PersonDto | null;
  note: string;
  at: string;
}

/** GET /api/revisions/:id/review. */
export interface RevisionReviewDto {
  revisionId: string;
  revisionNumber: number;
  studyId: string;
  projectId: string;
  author: PersonDto | null;
  state: ReviewState;
  request: {
    reviewer: PersonDto;
    requestedBy: PersonDto;
    note: string;
    submittedAt: string;
    decidedAt: string | null;
  } | null;
  comments: ReviewCommentDto[];
  events: ReviewEventDto[];
  signature: {
    summaryId: string;
    signer: PersonDto;
    signedAt: string;
    kid: string;
    verificationCode: string;
  } | null;
}

/** One row of GET /api/review-queue: a revision waiting for the caller's review. */
export interface ReviewQueueItemDto {
  revisionId: string;
  revisionNumber: number;
  latestNumber: number;
  studyId: string;
  studyName: string;
  alternativeName: string;
  projectId: string;
  projectName: string;
  author: PersonDto | null;
  requestedBy: PersonDto;
  note: string;
  submittedAt: string;
  changeNote: string;
  /** The revision's current assessment: the flutter and divergence figures, margins and warning count the study shows. */
  assessment: StoredAssessmentDto;
  engineVersion: string;
  documentSha256: string;
}

/** One row of GET /api/summaries. */
export interface SummaryListItemDto {
  id: string;
  projectId: string;
  projectName: string;
  alternativeName: string;
  studyId: string;
  studyName: string;
  revisionNumber: number;
  signer: PersonDto;
  signedAt: string;
  flutterSpeedMps: number | null;
  /** Worst status over the margins (fail > undetermined > investigate > pass; clear and not-evaluated count as pass). */
  outcome: "pass" | "fail" | "undetermined" | "investigate";
  /** The phenomena whose check fails, is undetermined, asks for investigation or was not evaluated, in the summary's order. */
  attention: { phenomenon: string; status: "fail" | "undetermined" | "investigate" | "not-evaluated" }[];
  current: boolean;
  newerUnsigned: boolean;
}

export interface SummaryBranchDto {
  id: string;
  steps: { speed: number; frequency: number; damping: number; re: number; im: number }[];
}

/** GET /api/summaries/:id. */
export interface SummaryDto {
  id: string;
  revisionId: string;
  studyId: string;
  projectId: string;
  /** The payload exactly as signed: format 2, or format 1 for summaries signed before it. */
  payload: SignedSummaryPayload;
  jws: string;
  kid: string;
  payloadSha256: string;
  verificationCode: string;
  /** No later revision of the same study has been signed. */
  current: boolean;
  /** The newest signed summary of the study, when this one is superseded. */
  currentSummary: { id: string; revisionNumber: number; signedAt: string } | null;
  /** Later revisions of the same study exist that are not signed (in work or in review). */
  newerUnsigned: boolean;
  newestRevisionNumber: number;
  /** Pole paths of the stored result of the signed revision (same content hash), for the plots. */
  branches: SummaryBranchDto[];
  /** How many of the solved steps `branches` carries (the stored result's `sampling`; null for older results). */
  branchSampling: SweepSampling | null;
  /** Absolute address of the published keys (JWKS). */
  jwksUrl: string;
  /** Absolute address of the public page that verifies this summary by its code (printed on the PDF). */
  verificationUrl: string;
}
