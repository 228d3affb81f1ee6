/**
 * Contract of the deck alternatives API (`/api/projects/:projectId/alternatives`, `/api/alternatives/:id`).
 * Identifiers travel as decimal strings, times as ISO 8601. Lengths in metres.
 */
import { z } from "zod";
import { normalNumber, userText } from "./input-rules";
import { DECK_DEPTH_LIMITS_M, DECK_WIDTH_LIMITS_M } from "./study";

const text = (max: number) => userText().trim().max(max, `must have at most ${max} characters`);
/** A length within the study format's limits for the same quantity, so a study started from the alternative is valid. */
const lengthM = (description: string, limits: { readonly min: number; readonly max: number }) =>
  normalNumber({ error: "must be a number" })
    .positive("must be greater than 0")
    .refine((v) => !(v > 0 && v < limits.min), `must be at least ${limits.min} m`)
    .refine((v) => !(v > limits.max), `must be at most ${limits.max} m`)
    .describe(description);

/** POST /api/projects/:projectId/alternatives (analysts). */
export const createAlternativeSchema = z.strictObject({
  name: text(200).min(1, "must not be blank"),
  description: text(5000).default(""),
  deckWidthM: lengthM("Deck width B, m (pre-fills new studies; each study document keeps its own)", DECK_WIDTH_LIMITS_M),
  deckDepthM: lengthM("Deck depth D, m", DECK_DEPTH_LIMITS_M),
});
export type CreateAlternativeInput = z.input<typeof createAlternativeSchema>;
export type CreateAlternative = z.infer<typeof createAlternativeSchema>;

/** PATCH /api/alternatives/:id (analysts): any of the fields, at least one. */
export const patchAlternativeSchema = z
  .strictObject({
    name: text(200).min(1, "must not be blank"),
    description: text(5000),
    deckWidthM: lengthM("Deck width B, m", DECK_WIDTH_LIMITS_M),
    deckDepthM: lengthM("Deck depth D, m", DECK_DEPTH_LIMITS_M),
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
