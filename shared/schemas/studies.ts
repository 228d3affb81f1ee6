/**
 * Contract of the studies API (`/api/alternatives/:id/studies`, `/api/studies/:id`). A study belongs to one deck
 * alternative; its content lives in numbered, immutable revisions (shared/schemas/revisions.ts).
 */
import { z } from "zod";
import { userText } from "./input-rules";
import { revisionSummarySchema } from "./revisions";
import { studyDocumentSchema } from "./study";

const text = (max: number) => userText().trim().max(max, `must have at most ${max} characters`);

/**
 * POST /api/alternatives/:id/studies (analysts). With `study`, revision 1 is computed and stored at once
 * (the response then holds it in `latestRevision`); without, the study starts empty and its first revision is
 * posted with `parentRevision: null`.
 */
export const createStudySchema = z.strictObject({
  name: text(200).min(1, "must not be blank"),
  purpose: text(5000).default(""),
  study: studyDocumentSchema.optional(),
});
export type CreateStudyInput = z.input<typeof createStudySchema>;
export type CreateStudy = z.infer<typeof createStudySchema>;

/** PATCH /api/studies/:id (analysts): name and purpose; the content changes only through new revisions. */
export const patchStudySchema = z
  .strictObject({ name: text(200).min(1, "must not be blank"), purpose: text(5000) })
  .partial()
  .refine((p) => Object.keys(p).length > 0, "give at least one of name, purpose");
export type PatchStudy = z.infer<typeof patchStudySchema>;

export const studySchema = z.object({
  id: z.string(),
  alternativeId: z.string(),
  alternativeName: z.string(),
  projectId: z.string(),
  name: z.string(),
  purpose: z.string(),
  revisionCount: z.number(),
  /** The newest revision (without document and result), or null before the first save. */
  latestRevision: revisionSummarySchema.nullable(),
  createdAt: z.string(),
  createdBy: z.object({ id: z.string(), name: z.string() }).nullable(),
});
export type StudyDto = z.infer<typeof studySchema>;
