/**
 * Contract of the deck alternatives API (`/api/projects/:projectId/alternatives`, `/api/alternatives/:id`).
 * Identifiers travel as decimal strings, times as ISO 8601. Lengths in metres.
 */
import { z } from "zod";

const text = (max: number) => z.string().trim().max(max, `must have at most ${max} characters`);
const lengthM = (description: string) =>
  z
    .number({ error: "must be a number" })
    .positive("must be greater than 0")
    .max(1000, "must be at most 1000")
    .describe(description);

/** POST /api/projects/:projectId/alternatives (analysts). */
export const createAlternativeSchema = z.strictObject({
  name: text(200).min(1, "must not be blank"),
  description: text(5000).default(""),
  deckWidthM: lengthM("Deck width B, m (pre-fills new studies; each study document keeps its own)"),
  deckDepthM: lengthM("Deck depth D, m"),
});
export type CreateAlternativeInput = z.input<typeof createAlternativeSchema>;
export type CreateAlternative = z.infer<typeof createAlternativeSchema>;

/** PATCH /api/alternatives/:id (analysts): any of the fields, at least one. */
export const patchAlternativeSchema = z
  .strictObject({
    name: text(200).min(1, "must not be blank"),
    description: text(5000),
    deckWidthM: lengthM("Deck width B, m"),
    deckDepthM: lengthM("Deck depth D, m"),
  })
  .partial()
  .refine((p) => Object.keys(p).length > 0, "give at least one of name, description, deckWidthM, deckDepthM");
export type PatchAlternative = z.infer<typeof patchAlternativeSchema>;

/** Cross-section image types accepted by PUT /api/alternatives/:id/image (checked by content type and magic bytes). */
export const IMAGE_TYPES = ["image/png", "image/jpeg", "image/svg+xml"] as const;
export const MAX_IMAGE_BYTES = 5 * 1024 * 1024;

export const alternativeSchema = z.object({
  id: z.string(),
  projectId: z.string(),
  name: z.string(),
  description: z.string(),
  deckWidthM: z.number().describe("Deck width B, m"),
  deckDepthM: z.number().describe("Deck depth D, m"),
  /** Present when a cross-section image was uploaded; fetch it from `GET /api/alternatives/:id/image`. */
  image: z
    .object({
      contentType: z.enum(IMAGE_TYPES),
      sizeBytes: z.number().describe("Image size, bytes"),
      sha256: z.string(),
      uploadedAt: z.string(),
    })
    .nullable(),
  studyCount: z.number(),
  datasetCount: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type AlternativeDto = z.infer<typeof alternativeSchema>;
