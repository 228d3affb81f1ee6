/**
 * The assessment of one study revision (`stillspan.assessment/1`): everything a reader is told about it, computed
 * once by `assessRevision` (shared/assessment/assess-revision.ts) from the revision's document, its sweep result and
 * a version of the project's criteria, and stored append-only beside the revision. The study workspace, the
 * comparison, the review queue, the signed summary and its PDF all read this object; none of them derives a
 * critical speed of its own. Units are SI (m/s, Hz); each numeric field's `.describe()` names its unit.
 */
import { z } from "zod";
import { flutterKindSchema } from "./result";

export const ASSESSMENT_FORMAT = "stillspan.assessment/1";

const text = (max: number) => z.string().max(max);
const speedMps = (what: string) => z.number().describe(`${what}, m/s (mean wind at deck level)`);
const statement = text(2000).describe("The figure in words, as every screen and the PDF print it");

/** What an assessment was computed from; its key in storage (with the revision it belongs to). */
export const assessmentSourceSchema = z.strictObject({
  assessor: text(40).describe("Version of the assessment's own rules and wording (a new one assesses stored revisions again)"),
  criteriaVersion: z.number().int().positive().nullable().describe("Version of the project's criteria used; null: none saved yet"),
  results: z
    .array(
      z.strictObject({
        kind: z.enum(["sweep"]).describe("Kind of stored result (later also angle-of-attack envelope, amplitudes, sensitivity)"),
        engineVersion: text(40).describe("Engine version that computed it"),
      }),
    )
    .min(1)
    .describe("The stored results of the revision the assessment used, the sweep first"),
});

/** Whether a critical point rests on tested data: its own reduced velocity against the table's tested range. */
export const testedRangeSchema = z.strictObject({
  status: z
    .enum(["within", "beyond", "no-table"])
    .describe("within / beyond the derivative table's tested Ur range; no-table for thin-plate or quasi-steady theory"),
  tableReducedVelocity: z.tuple([z.number(), z.number()]).nullable().describe("Tested range [min, max] of Ur = U/(fB), dimensionless"),
  beyondBy: z.number().nonnegative().nullable().describe("How far the point's Ur lies outside the tested range, dimensionless; null when within"),
  statement,
});

export const assessedFlutterSchema = z.discriminatedUnion("found", [
  z.strictObject({
    found: z.literal(true),
    speedMps: speedMps("Flutter speed: lowest speed where an oscillating pole's damping ratio crosses zero"),
    frequencyHz: z.number().describe("Frequency of the critical pole, Hz"),
    reducedVelocity: z.number().describe("Ur = U/(fB) of the critical pole, dimensionless"),
    kind: flutterKindSchema,
    branch: text(16).describe("Structural mode the critical branch started from"),
    testedRange: testedRangeSchema,
    basis: statement,
    statement,
  }),
  z.strictObject({
    found: z.literal(false),
    upToMps: speedMps("Highest speed solved: no flutter up to it"),
    basis: statement,
    statement,
  }),
]);

export const DIVERGENCE_BASES = ["closed-form", "static-instability"] as const;

export const assessedDivergenceSchema = z.strictObject({
  closedForm: z.strictObject({
    speedMps: speedMps("Closed-form torsional divergence √(2Iω_α²/(ρB²S)) (EN 1991-1-4 E.4.3, Expr. (E.24))").nullable(),
    withinSweep: z.boolean().describe("True when it lies inside the swept range"),
    momentSlope: z.number().nullable().describe("S = dC_M/dα used, per radian (moment on ½ρU²B²); null when none"),
    slopeSource: statement,
    basis: statement,
    statement,
  }),
  staticInstability: z.strictObject({
    speedMps: speedMps("Lowest speed where a real (static) pole of the sweep crosses zero").nullable(),
    branch: text(16).nullable().describe("Structural mode the crossing branch started from"),
    furtherSpeedsMps: z.array(z.number()).describe("Further crossings on other branches, m/s"),
    upToMps: speedMps("Highest speed solved"),
    basis: statement,
    statement,
  }),
  governing: z
    .enum([...DIVERGENCE_BASES, "none"])
    .describe("The figure the margin uses: the lower of the two found; none when divergence cannot occur"),
  governingSpeedMps: speedMps("The speed the divergence margin uses").nullable(),
  marginBasis: statement.describe("Which figure the margin uses and why, as every screen and the PDF state it"),
});

export const STABILITY_CHECKS = ["flutter", "divergence", "gallopingOnset"] as const;
export type StabilityCheck = (typeof STABILITY_CHECKS)[number];

export const stabilityMarginSchema = z.strictObject({
  status: z.enum(["pass", "fail", "undetermined", "not-evaluated"]).describe("Verdict of the stability check"),
  margin: z.number().nonnegative().nullable().describe("Critical ÷ required speed (a lower bound when marginIsLowerBound); null: no ratio"),
  marginIsLowerBound: z.boolean(),
  criticalSpeedMps: speedMps("Critical speed the margin uses").nullable(),
  requiredSpeedMps: speedMps("Required speed of the project's criteria"),
  statement,
});

export const requiredSpeedSchema = z.strictObject({
  phenomenon: z.enum(["flutter", "divergence", "vortexOnset", "gallopingOnset"]),
  requiredSpeedMps: speedMps("Required speed: factor × multipliers × v_m"),
  totalFactor: z.number().positive(),
  factor: z.number().positive(),
  gustFactor: z.number().positive().nullable(),
  angleFactor: z.number().positive().nullable(),
  basis: z.array(text(2000)).describe("Basis of each factor, in the order they multiply"),
});

export const vortexScreeningSchema = z.strictObject({
  status: z
    .enum(["investigate", "clear", "not-evaluated"])
    .describe("investigate: lock-in possible in the design wind range (amplitude and acceleration checks needed); clear: not expected"),
  onsetSpeedMps: speedMps("Lowest vortex-shedding onset over the modes").nullable(),
  mode: text(16).nullable(),
  thresholdSpeedMps: speedMps("Onset above which vortex shedding needs no investigation (criteria: factor × v_m)").nullable(),
  statement,
});

export const assessedWarningSchema = z.strictObject({
  code: text(80),
  title: text(200),
  /** The engine's own sentence: what, where, which branch. */
  message: text(2000),
  /** What the code means for the numbers; null for a code this build does not know. */
  explanation: text(2000).nullable(),
  /** The speeds concerned in words ("49.0–120.0 m/s", "at 94.9 m/s"). */
  speeds: text(200).nullable(),
  branch: text(16).nullable(),
});

export const assessmentSchema = z.strictObject({
  format: z.literal(ASSESSMENT_FORMAT),
  computedFrom: assessmentSourceSchema,
  sweep: z.strictObject({
    fromMps: speedMps("First speed of the sweep"),
    toMps: speedMps("Last speed of the sweep"),
    stepMps: z.number().positive().describe("Speed step of the grid, m/s (refined locally near critical points)"),
    lastSolvedMps: speedMps("Highest speed solved"),
  }),
  aerodynamics: z.strictObject({
    model: z.enum(["tabulated", "flat-plate", "quasi-steady"]),
    testedReducedVelocity: z.tuple([z.number(), z.number()]).nullable(),
    statement,
  }),
  flutter: assessedFlutterSchema,
  divergence: assessedDivergenceSchema,
  selberg: z.strictObject({ speedMps: speedMps("Selberg's empirical estimate").nullable(), statement }),
  designWind: z
    .strictObject({
      meanSpeedMps: speedMps("Design mean wind speed v_m at deck level"),
      basicSpeedMps: speedMps("Basic wind speed v_b"),
      deckHeightM: z.number().positive().describe("Deck height, m"),
      sources: z.array(text(2000)),
    })
    .nullable()
    .describe("null without criteria (or when they cannot be evaluated: see criteriaNote)"),
  required: z.array(requiredSpeedSchema).nullable(),
  criteriaNote: text(2000).nullable().describe("Why there are no margins, when there are none"),
  margins: z
    .strictObject({ flutter: stabilityMarginSchema, divergence: stabilityMarginSchema, gallopingOnset: stabilityMarginSchema })
    .nullable()
    .describe("Stability limits against the required speeds; null without criteria"),
  vortexShedding: vortexScreeningSchema.describe("A screening result with its own wording, not a stability margin"),
  verdict: z
    .enum(["pass", "fail", "undetermined", "no-criteria"])
    .describe(
      "Over the stability margins: fail if any fails, else undetermined if any needs a longer sweep, else pass (a check not " +
        "evaluated says why in its statement); no-criteria without margins",
    ),
  warnings: z.array(assessedWarningSchema),
  warningCount: z.number().int().nonnegative().describe("Warnings of the computation, including any left out of a long list"),
  cautions: z.array(text(1000)),
});

export type Assessment = z.infer<typeof assessmentSchema>;
export type AssessedFlutter = z.infer<typeof assessedFlutterSchema>;
export type AssessedDivergence = z.infer<typeof assessedDivergenceSchema>;
export type StabilityMargin = z.infer<typeof stabilityMarginSchema>;
export type AssessedWarning = z.infer<typeof assessedWarningSchema>;
export type AssessmentSource = z.infer<typeof assessmentSourceSchema>;
export type TestedRange = z.infer<typeof testedRangeSchema>;

/** An assessment as the API gives it: stored with an id and a time, for the revision it belongs to. */
export const storedAssessmentSchema = z.object({
  id: z.string(),
  revisionId: z.string(),
  createdAt: z.string(),
  assessment: assessmentSchema,
});
export type StoredAssessmentDto = z.infer<typeof storedAssessmentSchema>;
