/**
 * Contract of the aerodynamic data sets API (`/api/alternatives/:id/datasets`, `/api/datasets/:id`).
 *
 * A data set is uploaded as `multipart/form-data` with two parts: `file` (the CSV, kept byte for byte with its
 * SHA-256) and `meta` (a JSON text matching `datasetMetaSchema`). Flutter derivatives are stored as delivered and
 * converted to the study convention (docs/conventions.md §Self-excited forces: Ur = U/(fB), Scanlan's forces on the full width B, h and
 * L downward, α and M nose-up); static coefficients keep C_D on B or D as delivered and are also given on B.
 */
import { z } from "zod";
import { normalNumber, userText, zeroOrAtLeast } from "./input-rules";

const text = (max: number) => userText().trim().max(max, `must have at most ${max} characters`);
const finite = (description: string) => normalNumber({ error: "must be a number" }).describe(description);

export const DATASET_KINDS = ["flutter-derivatives", "static-coefficients"] as const;
export const datasetKindSchema = z.enum(DATASET_KINDS);

/** Largest CSV accepted, bytes. */
export const MAX_DATASET_FILE_BYTES = 1024 * 1024;

/** Where and how the section model was tested. Every field but `flow` is optional. */
export const provenanceSchema = z.strictObject({
  facility: text(1000).default("").describe("Test facility (wind tunnel, section-model rig)"),
  modelScale: normalNumber({ error: "must be a number" })
    .min(1, "must be at least 1: give the scale's denominator (60 for 1:60), not the ratio")
    .nullable()
    .default(null)
    .describe("Length-scale denominator of the section model, dimensionless (60 for 1:60)"),
  reynoldsNumber: normalNumber({ error: "must be a number" })
    .min(1, "must be at least 1")
    .nullable()
    .default(null)
    .describe("Reynolds number of the tests, on the deck width B, dimensionless"),
  turbulenceIntensityPct: zeroOrAtLeast(
    normalNumber({ error: "must be a number" }).min(0, "must be at least 0").max(100, "must be at most 100"),
    0.01,
    " %",
  )
    .nullable()
    .default(null)
    .describe("Longitudinal turbulence intensity of the oncoming flow, %"),
  flow: z.enum(["smooth", "turbulent"], { error: 'must be "smooth" or "turbulent"' }),
  testDate: z.iso.date("must be a date YYYY-MM-DD").nullable().default(null),
  notes: text(5000).default(""),
});
export type Provenance = z.infer<typeof provenanceSchema>;

/** How a flutter-derivative set was delivered (shared/engine/aero/convert-convention.ts). */
export const derivativeConventionSchema = z.strictObject({
  abscissa: z
    .enum(["Ur", "Ur-half", "K", "k-half"], { error: 'must be "Ur", "Ur-half", "K" or "k-half"' })
    .describe("Ur = U/(fB); Ur-half = U/(fb), b = B/2; K = Bω/U; k-half = bω/U"),
  normalisation: z
    .enum(["B", "2B"], { error: 'must be "B" or "2B"' })
    .describe("B: ½ρU²B and ½ρU²B² (ours); 2B: ½ρU²(2B), ½ρU²(2B²) — values half of ours"),
  sign: z.enum(["h-down", "h-up"], { error: 'must be "h-down" or "h-up"' }).describe("h-down: h and L downward (ours)"),
});
export type DerivativeConventionInput = z.infer<typeof derivativeConventionSchema>;

const common = {
  name: text(200).min(1, "must not be blank"),
  meanAngleDeg: finite("Mean angle of attack of the tests, degrees (nose-up positive)")
    .min(-90, "must be at least -90°")
    .max(90, "must be at most 90°")
    .default(0),
  provenance: provenanceSchema,
};

/** Angle window (degrees) over which the static slopes at 0° are fitted by least squares. */
export const slopeWindowSchema = z
  .strictObject({
    fromDeg: finite("Lower end of the fitting window, degrees"),
    toDeg: finite("Upper end of the fitting window, degrees"),
  })
  .refine((w) => w.fromDeg < w.toDeg, { message: "fromDeg must be less than toDeg", path: ["toDeg"] });

/** The `meta` part of the upload. */
export const datasetMetaSchema = z.discriminatedUnion("kind", [
  z.strictObject({ ...common, kind: z.literal("flutter-derivatives"), convention: derivativeConventionSchema }),
  z.strictObject({
    ...common,
    kind: z.literal("static-coefficients"),
    dragReference: z.enum(["B", "D"], { error: 'must be "B" or "D"' }).describe("C_D normalised on the width B or the depth D"),
    slopeWindow: slopeWindowSchema.default({ fromDeg: -2, toDeg: 2 }),
  }),
]);
export type DatasetMeta = z.infer<typeof datasetMetaSchema>;
export type DatasetMetaInput = z.input<typeof datasetMetaSchema>;

/** PATCH /api/datasets/:id: name and provenance only; values are changed by uploading a new data set. */
export const patchDatasetSchema = z
  .strictObject({ name: common.name, meanAngleDeg: common.meanAngleDeg.unwrap(), provenance: provenanceSchema })
  .partial()
  .refine((p) => Object.keys(p).length > 0, "give at least one of name, meanAngleDeg, provenance");
export type PatchDataset = z.infer<typeof patchDatasetSchema>;

const derivativeColumns = {
  H1: z.array(z.number()),
  H2: z.array(z.number()),
  H3: z.array(z.number()),
  H4: z.array(z.number()),
  A1: z.array(z.number()),
  A2: z.array(z.number()),
  A3: z.array(z.number()),
  A4: z.array(z.number()),
};

/** Flutter derivatives as delivered (abscissa in the delivered unit) — the CSV's numbers, missing columns as zeros. */
export const deliveredDerivativesSchema = z.object({ abscissa: z.array(z.number()), ...derivativeColumns });
/** Flutter derivatives in the study convention, rows in increasing Ur = U/(fB). */
export const convertedDerivativesSchema = z.object({ reducedVelocity: z.array(z.number()), ...derivativeColumns });

export const staticRowSchema = z.object({
  angleDeg: z.number().describe("Angle of attack, degrees, nose-up positive"),
  CD: z.number().describe("Drag coefficient (on B or D as delivered), dimensionless"),
  CL: z.number().describe("Lift coefficient on ½ρU²B, lift positive up, dimensionless"),
  CM: z.number().describe("Moment coefficient on ½ρU²B², nose-up, dimensionless"),
});

/** Least-squares lines through the points of the window: value at 0° and slope. */
export const staticSlopesSchema = z.object({
  window: z.object({ fromDeg: z.number(), toDeg: z.number() }),
  pointCount: z.number().describe("Rows inside the window"),
  dragCoefficientOnB: z.number().describe("C_D at 0° on ½ρU²B, dimensionless"),
  liftCoefficient: z.number().describe("C_L at 0°, dimensionless"),
  momentCoefficient: z.number().describe("C_M at 0°, dimensionless"),
  dragSlopePerRad: z.number().describe("dC_D/dα on B at 0°, per radian"),
  liftSlopePerRad: z.number().describe("dC_L/dα at 0°, per radian"),
  momentSlopePerRad: z.number().describe("dC_M/dα at 0°, per radian"),
});

export const datasetWarningSchema = z.object({ message: z.string(), column: z.string().optional() });

export const datasetSchema = z.object({
  id: z.string(),
  alternativeId: z.string(),
  projectId: z.string(),
  name: z.string(),
  kind: datasetKindSchema,
  meanAngleDeg: z.number(),
  provenance: provenanceSchema,
  /** Flutter derivatives only. */
  convention: derivativeConventionSchema.nullable(),
  /** Static coefficients only. */
  dragReference: z.enum(["B", "D"]).nullable(),
  /** Deck width B and depth D used for the conversion (the alternative's, at upload), m. */
  deckWidthM: z.number(),
  deckDepthM: z.number(),
  delivered: z.union([deliveredDerivativesSchema, z.object({ rows: z.array(staticRowSchema) })]),
  converted: z.union([convertedDerivativesSchema, z.object({ rows: z.array(staticRowSchema) })]),
  /** Static coefficients only: the fitted values and slopes at 0°. */
  slopes: staticSlopesSchema.nullable(),
  /** Flutter derivatives: tested Ur = U/(fB) range; static: tested angle range in degrees. */
  testedRange: z.object({ min: z.number(), max: z.number() }),
  warnings: z.array(datasetWarningSchema),
  file: z.object({ name: z.string(), sizeBytes: z.number(), sha256: z.string() }),
  createdAt: z.string(),
  createdBy: z.object({ id: z.string(), name: z.string() }).nullable(),
});
export type DatasetDto = z.infer<typeof datasetSchema>;

/** One problem in an uploaded file: `row` is the line number in the file (the header is line 1), `column` its name. */
export const uploadIssueSchema = z.object({
  row: z.number().optional(),
  column: z.string().optional(),
  message: z.string(),
});
export type UploadIssue = z.infer<typeof uploadIssueSchema>;
