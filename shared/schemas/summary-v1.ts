/**
 * The signed stability summary `stillspan.summary/1`, the format signed before summaries carried their inputs and
 * the revision's stored assessment (the current format is `stillspan.summary/2`, shared/schemas/summary.ts). Kept so
 * that every summary signed in it still verifies and displays exactly as signed: what a reviewer signed for one study
 * revision and what the owner's representative reads. The server signs the RFC 8785 canonical JSON of this object (compact JWS, EdDSA);
 * anyone holding the JWKS can check that the numbers below are exactly what was computed and signed.
 *
 * Units are SI (m/s, Hz); each numeric field's `.describe()` names its unit. The numbers are copied from the
 * stored sweep result (shared/schemas/result.ts) and the project's criteria (shared/criteria: required speeds and
 * margins), never recomputed for the summary.
 */
import { z } from "zod";
import { userText } from "./input-rules";
import { PHENOMENA } from "./criteria";
import { flutterKindSchema } from "./result";

export const SUMMARY_FORMAT_V1 = "stillspan.summary/1";

const text = (max: number) =>
  userText().trim().min(1, "must not be blank").max(max, `must have at most ${max} characters`);
const id = z.string().min(1).max(64).describe("Database identifier of the object");
const sha256 = z.string().regex(/^[0-9a-f]{64}$/, "must be 64 lower-case hex digits (SHA-256)");
const speedMps = (what: string) => z.number().nonnegative().describe(`${what}, m/s (mean wind at deck level)`);
const frequencyHz = (what: string) => z.number().nonnegative().describe(`${what}, Hz`);

const summaryModelSchema = z.strictObject({
  kind: z.enum(["section-model", "multimode"]).describe("Structural model of the study"),
  degreesOfFreedom: z
    .number()
    .int()
    .positive()
    .describe("Number of structural degrees of freedom (2 for a section model)"),
  aerodynamics: z
    .enum(["tabulated", "flat-plate", "quasi-steady"])
    .describe("Self-excited force model: measured derivatives, thin-plate theory or quasi-steady theory"),
});

const summaryAeroDataSchema = z.strictObject({
  name: text(200).describe("Name of the aerodynamic data set, or of the theory used"),
  origin: z.enum(["measured", "theoretical"]).describe("Wind-tunnel measurement or theory"),
  sha256: sha256.nullable().describe("SHA-256 of the uploaded file as received; null for theory"),
  deliveredConvention: z
    .strictObject({
      abscissa: text(40).describe("Abscissa as delivered, e.g. U/(fB), U/(fb), K = Bω/U, k = bω/U"),
      normalisation: text(40).describe("Force normalisation as delivered, e.g. ½ρU²B or 2B"),
      signConvention: text(40).describe("Sign convention as delivered, e.g. h and L downward"),
    })
    .nullable()
    .describe("How the measured derivatives were delivered (converted to the study's convention); null for theory"),
  testedReducedVelocity: z
    .tuple([z.number(), z.number()])
    .nullable()
    .describe("Tested range of reduced velocity U/(fB), dimensionless [min, max]; null for theory"),
  facility: text(500).nullable().describe("Test facility and conditions, as recorded with the data set"),
});

const summaryFlutterSchema = z.strictObject({
  speedMps: speedMps("Flutter speed: lowest speed where an oscillatory pole's damping ratio crosses zero"),
  frequencyHz: frequencyHz("Frequency of the critical pole at the flutter speed"),
  mode: text(16).describe("Structural mode the critical branch started from"),
  kind: flutterKindSchema,
  reducedVelocity: z.number().positive().describe("Ur = U/(fB) at flutter, dimensionless"),
});

const summaryDivergenceSchema = z.strictObject({
  speedMps: speedMps("Torsional divergence speed (closed form)"),
  frequencyHz: frequencyHz("Frequency at divergence: 0, a static instability"),
});

const summaryDesignWindSchema = z.strictObject({
  meanSpeedMps: speedMps("Design mean wind speed v_m at deck level"),
  basicSpeedMps: speedMps("Basic wind speed v_b (10-min mean, 10 m, open terrain, p = 0.02)"),
  deckHeightM: z.number().positive().describe("Deck height above ground or water, m"),
  sources: z.array(text(500)).describe("Standards and clauses the design wind follows"),
});

const summaryCriterionSchema = z.strictObject({
  phenomenon: z.enum(PHENOMENA).describe("Instability the criterion applies to"),
  requiredSpeedMps: speedMps("Speed the critical speed must reach: factor × multipliers × v_m"),
  totalFactor: z.number().positive().describe("Product of the factor and its multipliers, dimensionless"),
  factor: z.number().positive().describe("Factor on the design mean wind at deck level, dimensionless"),
  gustFactor: z.number().positive().nullable().describe("Gust / span multiplier, dimensionless; null when none"),
  angleFactor: z.number().positive().nullable().describe("Angle-of-attack multiplier, dimensionless; null when none"),
  basis: z.array(text(2000)).min(1).describe("Basis of each factor, in the order they multiply"),
});

const summaryMarginSchema = z.strictObject({
  phenomenon: z.enum(PHENOMENA).describe("Instability checked"),
  status: z
    .enum(["pass", "fail", "undetermined", "investigate", "clear", "not-evaluated"])
    .describe(
      "Outcome of the check: stability limits (flutter, divergence, galloping) pass / fail / undetermined; the " +
        "vortex-shedding onset investigate (lock-in possible in the design range: amplitude and acceleration checks " +
        "needed) / clear; not-evaluated with its reason in the statement",
    ),
  margin: z
    .number()
    .nonnegative()
    .nullable()
    .describe("Critical ÷ required speed, dimensionless (a lower bound when marginIsLowerBound); null: no ratio"),
  marginIsLowerBound: z.boolean().describe("True when no instability was found up to the sweep end"),
  criticalSpeedMps: speedMps("Critical speed found; null when not found or not possible").nullable(),
  requiredSpeedMps: speedMps("Required speed"),
  statement: text(1000).describe("The check in one sentence, as shown beside the numbers"),
});

const summaryWarningSchema = z.strictObject({
  code: text(80).describe("Stable machine-readable code of the warning"),
  message: text(1000).describe("The warning as shown to the reader"),
});

export const summaryPayloadV1Schema = z.strictObject({
  format: z.literal(SUMMARY_FORMAT_V1),
  project: z.strictObject({ id, name: text(200) }),
  alternative: z.strictObject({ id, name: text(200) }),
  study: z.strictObject({ id, name: text(200) }),
  revision: z.strictObject({
    id,
    number: z.number().int().positive().describe("Revision number within the study (1, 2, …)"),
    contentHash: sha256.describe("SHA-256 over the RFC 8785 canonical JSON of the study document"),
    createdAt: z.iso.datetime({ offset: true }).describe("When the revision was computed and stored (ISO 8601)"),
  }),
  engineVersion: text(40).describe("Version of the engine that computed the result"),
  model: summaryModelSchema,
  aerodynamicData: summaryAeroDataSchema,
  sweep: z.strictObject({
    fromMps: speedMps("First speed of the sweep"),
    toMps: speedMps("Last speed of the sweep"),
    airDensityKgM3: z.number().nonnegative().describe("Air density, kg/m³"),
  }),
  flutter: summaryFlutterSchema.nullable().describe("null: every branch stays damped up to sweep.toMps"),
  divergence: summaryDivergenceSchema
    .nullable()
    .describe("null: no divergence (static moment slope ≤ 0)"),
  designWind: summaryDesignWindSchema,
  criteria: z.array(summaryCriterionSchema).describe("Required speed per phenomenon with its factors and basis"),
  margins: z.array(summaryMarginSchema).describe("Margin of each critical speed against its required speed"),
  warnings: z.array(summaryWarningSchema).describe("Warnings of the computation (extrapolation, model limits, …)"),
  signer: z.strictObject({ name: text(200), email: z.email() }),
  signedAt: z.iso.datetime({ offset: true }).describe("Signing time (ISO 8601, UTC)"),
  statement: text(4000).describe("The reviewer's statement, in the reviewer's words"),
});

export type SummaryPayloadV1 = z.infer<typeof summaryPayloadV1Schema>;
