/**
 * Contract of GET /api/projects/:projectId/comparison: the latest revision of every study of every deck
 * alternative side by side with its assessment (margins against the project's required speeds), and per-study
 * trends of the critical speeds over all revisions — every figure read from the revisions' stored assessments.
 */
import { z } from "zod";
import { storedAssessmentSchema } from "./assessment";
import { personSchema } from "./revisions";

export const comparisonRowSchema = z.object({
  alternativeId: z.string(),
  alternativeName: z.string(),
  studyId: z.string(),
  studyName: z.string(),
  /** Null for a study without revisions. */
  latest: z
    .object({
      revisionId: z.string(),
      number: z.number(),
      createdAt: z.string(),
      author: personSchema.nullable(),
      engineVersion: z.string(),
      /** The revision's current assessment: critical speeds with their basis, margins, warnings. */
      assessment: storedAssessmentSchema,
      /** What was computed: the revision document's deck and structure. */
      deck: z.object({ widthM: z.number().describe("Deck width B, m"), depthM: z.number().describe("Deck depth D, m") }),
      structure: z.object({
        massKgPerM: z.number().describe("Mass per unit length, kg/m"),
        inertiaKgM2PerM: z.number().describe("Mass moment of inertia per unit length, kg·m²/m"),
        modes: z.array(
          z.object({
            id: z.string(),
            dof: z.enum(["heave", "torsion"]),
            frequencyHz: z.number().describe("Still-air natural frequency, Hz"),
            damping: z.number().describe("Structural damping ratio, dimensionless"),
          }),
        ),
      }),
      aerodynamicModel: z.enum(["tabulated", "flat-plate", "quasi-steady"]),
    })
    .nullable(),
});

/** One revision's figures in a trend: read from its current assessment. */
export const trendPointSchema = z.object({
  revisionId: z.string(),
  number: z.number(),
  createdAt: z.string(),
  changeNote: z.string(),
  flutterSpeedMps: z.number().nullable().describe("Flutter speed, m/s; null: none up to sweepToMps"),
  flutterFrequencyHz: z.number().nullable(),
  divergenceSpeedMps: z.number().nullable().describe("The divergence figure the margin uses, m/s"),
  divergenceBasis: z.enum(["closed-form", "static-instability", "none"]),
  sweepToMps: z.number().describe("Highest speed solved, m/s"),
  warningCount: z.number(),
});

export const comparisonSchema = z.object({
  projectId: z.string(),
  /** The project's current criteria (version, v_m at deck level, required speeds), or null when none are saved. */
  criteria: z
    .object({
      version: z.number(),
      meanSpeedMps: z.number().describe("Design mean wind speed at deck level, m/s"),
      requiredFlutterSpeedMps: z.number(),
      requiredDivergenceSpeedMps: z.number(),
    })
    .nullable(),
  rows: z.array(comparisonRowSchema),
  /** Per study, every revision's critical speeds in revision order (for a trend chart). */
  trends: z.array(z.object({ studyId: z.string(), studyName: z.string(), alternativeName: z.string(), points: z.array(trendPointSchema) })),
});
export type ComparisonDto = z.infer<typeof comparisonSchema>;
export type ComparisonRow = z.infer<typeof comparisonRowSchema>;
