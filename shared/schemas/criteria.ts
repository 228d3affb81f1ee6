/**
 * Project design wind and acceptance criteria, and the screening request. Units are SI; each numeric field's
 * `.describe()` names its unit. Formulas and their clauses: docs/criteria.md and shared/criteria/.
 *
 * Messages are plain rule text ("must be greater than 0"); `formatStudyIssues` (shared/schemas/study.ts)
 * pairs each with the JSON path of the offending value.
 */
import { z } from "zod";
import type { EvaluatedCriteria } from "../criteria/evaluate-criteria";
import { normalNumber, userText } from "./input-rules";
import { studyDocumentSchema } from "./study";

const typeError = (expected: string) => (issue: { input?: unknown }) =>
  issue.input === undefined ? "is required" : `must be ${expected}`;

const number = (description: string) => normalNumber({ error: typeError("a number") }).describe(description);
const positive = (description: string) => number(description).positive({ error: "must be greater than 0" });
const text = (description: string, max: number) =>
  userText({ error: typeError("a string") })
    .max(max, { error: `must have at most ${max} characters` })
    .refine((value) => value.trim().length > 0, { error: "must not be blank" })
    .describe(description);

const object = <T extends z.ZodRawShape>(shape: T) =>
  z.strictObject(shape, {
    error: (issue) =>
      issue.code === "unrecognized_keys" ? "is not a field of this format" : typeError("an object")(issue),
  });

const unionError = (key: string, kinds: string) => (issue: { input?: unknown }) =>
  issue.input === undefined || typeof issue.input !== "object" || issue.input === null
    ? typeError("an object")(issue)
    : `must have "${key}" set to ${kinds}`;

export const TERRAIN_CATEGORY_VALUES = ["0", "I", "II", "III", "IV"] as const;

const terrainSchema = z.discriminatedUnion(
  "kind",
  [
    object({
      kind: z.literal("category"),
      category: z
        .enum(TERRAIN_CATEGORY_VALUES, { error: 'must be one of "0", "I", "II", "III", "IV"' })
        .describe("Terrain category of EN 1991-1-4 Table 4.1 (z0 and z_min from the table)"),
    }),
    object({
      kind: z.literal("roughness"),
      roughnessLength: positive("Roughness length z0, m"),
      minimumHeight: positive("Minimum height z_min below which the roughness factor is held constant, m"),
    }).superRefine((terrain, ctx) => {
      if (!(terrain.minimumHeight > terrain.roughnessLength)) {
        ctx.addIssue({
          code: "custom",
          path: ["minimumHeight"],
          message: `must be greater than roughnessLength (${terrain.roughnessLength} m)`,
        });
      }
    }),
  ],
  { error: unionError("kind", '"category" or "roughness"') },
);

const probabilitySchema = z.discriminatedUnion(
  "kind",
  [
    object({
      kind: z.literal("return-period"),
      years: number("Return period T of the design wind, years (p = 1/T; 50 years gives c_prob = 1)").gt(1, {
        error: "must be greater than 1",
      }),
    }),
    object({
      kind: z.literal("annual-probability"),
      value: number("Annual probability of exceedance p, dimensionless (0.02 gives c_prob = 1)")
        .gt(0, { error: "must be greater than 0" })
        .lt(1, { error: "must be less than 1" }),
    }),
    object({
      kind: z.literal("factor"),
      value: positive("Probability (return-period) factor c_prob given directly, dimensionless"),
      basis: text("Where the factor comes from (specification, National Annex clause)", 2000),
    }),
  ],
  { error: unionError("kind", '"return-period", "annual-probability" or "factor"') },
);

export const designWindSchema = object({
  basicSpeed: positive(
    "Basic wind speed v_b: 10-minute mean at 10 m above open terrain (category II), annual exceedance probability 0.02, m/s",
  ),
  probability: probabilitySchema.describe("Return period, annual probability or probability factor c_prob"),
  terrain: terrainSchema.describe("Terrain category or roughness length of the upwind terrain"),
  deckHeight: positive("Deck height z above ground or water, m (the profile ends at 200 m)").max(200, {
    error: "must be at most 200 (z_max of EN 1991-1-4 §4.3.2)",
  }),
  orographyFactor: positive("Orography factor c_o(z), dimensionless")
    .default(1)
    .describe("Orography factor c_o(z), dimensionless (default 1: flat terrain or open water)"),
});

const multiplierSchema = object({
  value: positive("Multiplier on the required speed, dimensionless"),
  basis: text("Basis of the multiplier: standard, clause or specification", 2000),
});

const requirementSchema = object({
  factor: positive("Factor on the design mean wind speed at deck level, dimensionless"),
  basis: text("Basis of the factor: standard, clause or specification (say when it is from memory)", 2000),
  gustFactor: multiplierSchema.optional().describe("Optional gust / span factor multiplied in, dimensionless"),
  angleFactor: multiplierSchema.optional().describe("Optional angle-of-attack factor multiplied in, dimensionless"),
});

export const PHENOMENA = ["flutter", "divergence", "vortexOnset", "gallopingOnset"] as const;
export type Phenomenon = (typeof PHENOMENA)[number];

export const projectCriteriaSchema = object({
  wind: designWindSchema,
  requirements: object({
    flutter: requirementSchema,
    divergence: requirementSchema,
    vortexOnset: requirementSchema,
    gallopingOnset: requirementSchema,
  }),
  notes: userText({ error: typeError("a string") })
    .max(4000, { error: "must have at most 4000 characters" })
    .optional()
    .describe("Free notes on the criteria (governing specification, agreements with the owner)"),
});

export type DesignWindInput = z.input<typeof designWindSchema>;
export type ProjectCriteria = z.infer<typeof projectCriteriaSchema>;
export type ProjectCriteriaInput = z.input<typeof projectCriteriaSchema>;

/**
 * Body of PUT /api/projects/:id/criteria (reviewers and administrators: the criteria owners). `baseVersion` (the
 * version the editor started from) guards against lost updates; `confirmBases` lists the phenomena whose basis the
 * saver confirms as written (a default text included) with this version.
 */
export const putCriteriaBodySchema = object({
  criteria: projectCriteriaSchema,
  confirmBases: z
    .array(z.enum(PHENOMENA, { error: 'must be "flutter", "divergence", "vortexOnset" or "gallopingOnset"' }), {
      error: typeError("a list of phenomena"),
    })
    .max(PHENOMENA.length, { error: `must have at most ${PHENOMENA.length} entries` })
    .optional()
    .describe("Phenomena whose basis the saver confirms with this version (recorded with their name and the time)"),
  baseVersion: normalNumber({ error: typeError("a whole number or null") })
    .int({ error: "must be a whole number" })
    .positive({ error: "must be greater than 0" })
    .nullable()
    .optional()
    .describe("Version the edit started from (null: there was none); a newer saved version gives 409"),
});
export type PutCriteriaBody = z.infer<typeof putCriteriaBodySchema>;

/**
 * Who stands behind one requirement's basis: confirmed as written ("confirmed", e.g. a default text a reviewer
 * accepts for the project) or saved as their own text ("written") by a criteria owner, in criteria version
 * `version`. Kept by later versions while the requirement stays unchanged.
 */
export interface BasisConfirmation {
  by: { id: string; name: string };
  at: string;
  version: number;
  how: "confirmed" | "written";
}
export type BasisConfirmations = Partial<Record<Phenomenon, BasisConfirmation>>;

/**
 * The state of one requirement's basis: `defaultText` when it is still one of the shipped default texts
 * (shared/criteria/default-requirements.ts); `confirmation` null while no reviewer or administrator has confirmed
 * or written it — signing a summary is then refused.
 */
export interface BasisStatus {
  defaultText: boolean;
  confirmation: BasisConfirmation | null;
}

/**
 * Response of GET/PUT /api/projects/:id/criteria. `evaluated` holds v_m at deck level with its factors and the
 * required speeds (shared/criteria/evaluate-criteria.ts); `defaults` the default factors with their basis.
 */
export interface ProjectCriteriaDto {
  projectId: string;
  /** Current version, or null when the project has no criteria yet. */
  version: number | null;
  criteria: ProjectCriteria | null;
  evaluated: EvaluatedCriteria | null;
  savedAt: string | null;
  savedBy: { id: string; name: string } | null;
  /** Per phenomenon, the state of the current version's basis; null when the project has no criteria yet. */
  bases: Record<Phenomenon, BasisStatus> | null;
  defaults: ProjectCriteria["requirements"];
}

/** One saved version, for the history list. */
export interface ProjectCriteriaVersionDto {
  version: number;
  savedAt: string;
  savedBy: { id: string; name: string } | null;
  criteria: ProjectCriteria;
  bases: Record<Phenomenon, BasisStatus>;
}

export const screeningOptionsSchema = object({
  strouhalNumber: positive("Strouhal number St on the deck depth D, dimensionless (measured on the deck section)")
    .max(1, { error: "must be at most 1" })
    .optional(),
  strouhalBasis: text("Where the Strouhal number comes from (test report, reference)", 2000).optional(),
  gallopingFactor: positive("Factor of galloping instability a_G, dimensionless").optional(),
  gallopingFactorBasis: text("Where a_G comes from (test report, reference); required with gallopingFactor", 2000).optional(),
  liftSlope: number("Static lift coefficient slope dC_L/dα at the mean angle, per radian, lift up, on ½ρU²B").optional(),
  dragCoefficient: number("Static drag coefficient C_D on ½ρU²B, dimensionless")
    .min(0, { error: "must be at least 0" })
    .optional(),
}).superRefine((options, ctx) => {
  if ((options.liftSlope === undefined) !== (options.dragCoefficient === undefined)) {
    const missing = options.liftSlope === undefined ? "liftSlope" : "dragCoefficient";
    ctx.addIssue({ code: "custom", path: [missing], message: "is required with the other static coefficient" });
  }
  if (options.gallopingFactor !== undefined && options.gallopingFactorBasis === undefined) {
    ctx.addIssue({ code: "custom", path: ["gallopingFactorBasis"], message: "is required with gallopingFactor: say where a_G comes from" });
  }
});

const studyShape = studyDocumentSchema.shape;

/** The parts of a study the screening reads; other study fields are accepted and ignored. */
export const screeningStudySchema = z
  .object(
    {
      air: studyShape.air,
      deck: studyShape.deck,
      structure: studyShape.structure,
      aerodynamics: studyShape.aerodynamics.optional(),
    },
    { error: typeError("an object") },
  )
  .superRefine((study, ctx) => {
    if (!(study.air.density > 0)) {
      ctx.addIssue({ code: "custom", path: ["air", "density"], message: "must be greater than 0 for screening" });
    }
  });

export const screeningRequestSchema = object({
  study: screeningStudySchema,
  projectId: z
    .union([z.string().regex(/^\d{1,9}$/), z.number().int().positive()], { error: "must be a project id" })
    .optional()
    .describe("Project whose current criteria apply when `criteria` is not given (caller must be its analyst or reviewer)"),
  criteria: projectCriteriaSchema.optional(),
  options: screeningOptionsSchema.optional(),
});

export type ScreeningStudy = z.infer<typeof screeningStudySchema>;
export type ScreeningOptions = z.infer<typeof screeningOptionsSchema>;
export type ScreeningRequest = z.infer<typeof screeningRequestSchema>;
