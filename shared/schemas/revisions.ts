/**
 * Contract of study revisions (`/api/studies/:id/revisions`, `/api/revisions/:id`, diff, re-run, export and
 * import). A revision is numbered 1, 2, … per study, never changed or deleted, and holds the full study
 * document (`stillspan.study/1`), its SHA-256 over RFC 8785 canonical JSON, the engine version and the result;
 * each revision DTO carries its current assessment (critical speeds with their basis, margins, warnings).
 * It is `superseded` when a newer revision of the same study exists.
 */
import { z } from "zod";
import { userText } from "./input-rules";
import { storedAssessmentSchema } from "./assessment";
import { sweepResultSchema } from "./result";
import { studyDocumentSchema } from "./study";

export const CHANGE_NOTE_MAX = 2000;

/**
 * POST /api/studies/:id/revisions (analysts). `parentRevision` is the number of the revision the edit started
 * from (null for the first revision of an empty study); when a newer revision exists the answer is 409
 * `stale_parent` and nothing is stored. `changeNote` is required from revision 2 on.
 */
export const createRevisionSchema = z.strictObject({
  parentRevision: z
    .number({ error: "must be a whole number or null" })
    .int("must be a whole number")
    .positive("must be greater than 0")
    .nullable(),
  changeNote: userText().trim().max(CHANGE_NOTE_MAX, `must have at most ${CHANGE_NOTE_MAX} characters`).default(""),
  study: studyDocumentSchema,
});
export type CreateRevisionInput = z.input<typeof createRevisionSchema>;

/**
 * Multipart fields of POST /api/studies/:id/import besides the `file` part (a study JSON file). `parentRevision`
 * is required like on a save: the number of the newest revision the import goes on top of, or empty for the first
 * revision of an empty study; 409 `stale_parent` when a newer one exists.
 */
export const importRevisionFieldsSchema = z.strictObject({
  parentRevision: z
    .string({ error: "is required: the number of the newest revision the import goes on top of (empty for the first revision)" })
    .regex(/^(\d{1,9}|null|)$/, "must be a revision number, or empty for the first revision")
    .transform((v) => (v === "" || v === "null" ? null : Number(v))),
  changeNote: userText().trim().max(CHANGE_NOTE_MAX, `must have at most ${CHANGE_NOTE_MAX} characters`).default(""),
});

/**
 * POST /api/revisions/:id/rerun (analysts): `parentRevision` is the study's newest revision as the caller saw it;
 * the re-run is stored on top of it, or refused with 409 `stale_parent` when someone saved in between.
 */
export const rerunRevisionSchema = z.strictObject({
  parentRevision: z.number({ error: "is required: the number of the study's newest revision" }).int("must be a whole number").positive("must be greater than 0"),
});

export const personSchema = z.object({ id: z.string(), name: z.string() });

export const revisionSummarySchema = z.object({
  id: z.string(),
  studyId: z.string(),
  number: z.number(),
  parentNumber: z.number().nullable(),
  author: personSchema.nullable(),
  changeNote: z.string(),
  documentSha256: z.string().describe("SHA-256 (hex) of the RFC 8785 canonical JSON of the study document"),
  engineVersion: z.string(),
  createdAt: z.string(),
  superseded: z.boolean(),
  /** What a reader is told about the revision's result: its current stored assessment (shared/schemas/assessment.ts). */
  assessment: storedAssessmentSchema,
});
export type RevisionSummaryDto = z.infer<typeof revisionSummarySchema>;

/** GET /api/revisions/:id and the 201 of a save. */
export const revisionSchema = revisionSummarySchema.extend({
  alternativeId: z.string(),
  projectId: z.string(),
  studyName: z.string(),
  latestNumber: z.number().describe("Number of the newest revision of the study"),
  study: studyDocumentSchema,
  result: sweepResultSchema,
});
export type RevisionDto = z.infer<typeof revisionSchema>;

/** `error.details` of a 409 `stale_parent`: the newer revision and the document that was not stored. */
export const staleParentDetailsSchema = z.object({
  latest: z.object({ id: z.string(), number: z.number(), author: personSchema.nullable(), createdAt: z.string() }),
  rejected: z.object({ parentRevision: z.number().nullable(), changeNote: z.string(), study: z.unknown() }),
});
export type StaleParentDetails = z.infer<typeof staleParentDetailsSchema>;

/** One difference between two study documents. Paths are JSON paths ("$.structure.modes[1].frequency"). */
export const documentChangeSchema = z.object({
  path: z.string(),
  kind: z.enum(["changed", "added", "removed"]),
  /** Absent when kind is "added". */
  old: z.unknown().optional(),
  /** Absent when kind is "removed". */
  new: z.unknown().optional(),
});

/** GET /api/revisions/:a/diff/:b: what changed from revision a to revision b. */
export const revisionDiffSchema = z.object({
  from: revisionSummarySchema,
  to: revisionSummarySchema,
  identical: z.boolean().describe("true when both documents have the same canonical hash"),
  changes: z.array(documentChangeSchema),
});
export type RevisionDiffDto = z.infer<typeof revisionDiffSchema>;
