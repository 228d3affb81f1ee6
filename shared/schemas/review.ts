/**
 * Contract of the review workflow (`/api/revisions/:id/{submit,return,sign,comments,review}`, `/api/review-queue`)
 * and of the signed summaries (`/api/summaries`). A revision is a draft until it is submitted; its review is then
 * `in-review`, and ends `returned` (with comments; it may be submitted again) or `signed` (final).
 */
import { z } from "zod";
import { userText } from "./input-rules";
import type { SweepSampling } from "./result";
import type { StoredAssessmentDto } from "./assessment";
import type { Phenomenon } from "./criteria";
import type { SignedSummaryPayload, SummaryPayload } from "./summary";

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

/**
 * POST /api/revisions/:id/sign (the assigned reviewer): the reviewer's statement, signed with the summary, and the
 * `previewSha256` of the summary preview they read (GET /api/revisions/:id/summary-preview). The server refuses
 * with 409 `preview_outdated` when the summary it would sign now differs from that preview.
 */
export const signReviewSchema = z.strictObject({
  statement: text(4000),
  previewSha256: z
    .string({ error: "is required: the previewSha256 of the summary preview you read before signing" })
    .regex(/^[0-9a-f]{64}$/, "must be 64 lower-case hex digits (the previewSha256 of the summary preview)"),
});
export type SignReviewInput = z.infer<typeof signReviewSchema>;

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
  /** Number of the study's newest revision: a returned revision older than it is not submitted again. */
  latestNumber: number;
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

/**
 * The review state of one revision, for the study header, the revision timeline and the project's studies table.
 * `reviewer`: the reviewer of its request (in review with, returned by, signed by). `supersededBy`: for a signed
 * revision, the number of a later signed revision of the same study; for a draft or a returned revision, the
 * number of the study's newest revision when a newer one exists (a returned revision is then not submitted again);
 * null otherwise, and always null while in review.
 */
export interface RevisionReviewStatusDto {
  revisionId: string;
  studyId: string;
  number: number;
  state: ReviewState;
  reviewer: PersonDto | null;
  decidedAt: string | null;
  supersededBy: number | null;
}

/**
 * GET /api/revisions/:id/summary-preview: the stability summary exactly as the server would sign it now, built by
 * the same builder as the signature. Only `signedAt` (here: when the preview was built) and `statement` (empty
 * here) are set at the moment of signing; `previewSha256` is the SHA-256 over the canonical JSON of the payload
 * without those two members, and the sign request carries it back.
 */
export interface SummaryPreviewDto {
  revisionId: string;
  revisionNumber: number;
  latestNumber: number;
  studyId: string;
  projectId: string;
  state: ReviewState;
  /** The reviewer the revision is assigned to (in review) or was (returned); null for a draft. */
  reviewer: PersonDto | null;
  payload: SummaryPayload;
  previewSha256: string;
  criteriaVersion: number;
  /** Criteria whose basis no reviewer has confirmed or written: signing is refused while any is listed. */
  unconfirmedBases: { phenomenon: Phenomenon; defaultText: boolean }[];
  /** The caller may sign or return the revision now: its assigned reviewer, not its author, while it is in review. */
  canDecide: boolean;
  /** Why the caller cannot sign this revision now (the above, or unconfirmed criteria bases), in one sentence; null when they can. */
  signBlocker: string | null;
  branches: SummaryBranchDto[];
  branchSampling: SweepSampling | null;
}
