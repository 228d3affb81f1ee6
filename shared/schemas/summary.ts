/**
 * The signed stability summary `stillspan.summary/2`: what a reviewer signs for one study revision and what the
 * owner's representative reads. The server signs the RFC 8785 canonical JSON of this object (compact JWS, EdDSA);
 * anyone holding the JWKS can check that the numbers below are exactly what was computed and signed.
 *
 * A summary carries its inputs (air, deck, structure with its mass and frequency ratios, the aerodynamic model with
 * the data set's provenance and conventions, the sweep), the revision's stored assessment as it was signed
 * (shared/schemas/assessment.ts: critical speeds with their basis, margins, screening, warnings), what changed since
 * the study's previously signed revision, and who prepared, checked and approved it. Units are SI; each numeric
 * field's `.describe()` names its unit. Summaries signed in format 1 (shared/schemas/summary-v1.ts) still verify.
 */
import { z } from "zod";
import { assessmentSchema } from "./assessment";
import { userText } from "./input-rules";
import { summaryPayloadV1Schema } from "./summary-v1";

export const SUMMARY_FORMAT = "stillspan.summary/2";
/** JWS algorithm of signed summaries: EdDSA with Ed25519 keys (RFC 8037). */
export const SUMMARY_JWS_ALG = "EdDSA";
/** `typ` header of a signed summary (RFC 7515 §4.1.9; "application/" omitted as the RFC recommends). */
export const SUMMARY_JWS_TYP = "stillspan-summary+jws";

const text = (max: number) =>
  userText().trim().min(1, "must not be blank").max(max, `must have at most ${max} characters`);
const id = z.string().min(1).max(64).describe("Database identifier of the object");
const sha256 = z.string().regex(/^[0-9a-f]{64}$/, "must be 64 lower-case hex digits (SHA-256)");
const time = (what: string) => z.iso.datetime({ offset: true }).describe(`${what} (ISO 8601)`);
const positive = (what: string) => z.number().positive().describe(what);

/** The convention every number of the study is written in (docs/conventions.md §Coordinates and signs). */
export const STUDY_CONVENTIONS =
  "Scanlan's self-excited forces on the full deck width B (½ρU²B, ½ρU²B²); K = Bω/U, Ur = U/(fB); h and L positive " +
  "downward, α and M positive nose-up; damping as a ratio of critical";

export const summaryInputsSchema = z.strictObject({
  airDensityKgM3: z.number().nonnegative().describe("Air density ρ, kg/m³"),
  deck: z.strictObject({ widthM: positive("Deck width B, m"), depthM: positive("Deck depth D, m") }),
  structure: z.strictObject({
    massKgPerM: positive("Mass per unit length m, kg/m"),
    inertiaKgM2PerM: positive("Mass moment of inertia per unit length I, kg·m²/m"),
    modes: z.array(
      z.strictObject({
        id: text(16),
        dof: z.enum(["heave", "torsion"]),
        frequencyHz: positive("Still-air natural frequency, Hz"),
        dampingRatio: z.number().nonnegative().describe("Structural damping ratio of critical, dimensionless"),
      }),
    ),
    massRatio: z.number().positive().nullable().describe("μ = m/(ρB²), dimensionless; null when ρ = 0"),
    inertiaRatio: z.number().positive().nullable().describe("I/(ρB⁴), dimensionless; null when ρ = 0"),
    frequencyRatio: positive("ε = f_α/f_h, torsional over heave frequency, dimensionless"),
    radiusOfGyrationM: positive("r = √(I/m), m"),
  }),
  aerodynamics: z.strictObject({
    model: z.enum(["tabulated", "flat-plate", "quasi-steady"]),
    description: text(500).describe("The model in words"),
    interpolation: z.enum(["linear", "monotone-cubic"]).nullable(),
    tableRows: z.number().int().positive().nullable(),
    testedReducedVelocity: z.tuple([z.number(), z.number()]).nullable().describe("Tested Ur range [min, max]; null for theory"),
    staticMomentSlopePerRad: z.number().nullable().describe("dC_M/dα given with the table, per radian; null when not given"),
    quasiSteady: z
      .strictObject({ liftSlopePerRad: z.number(), dragCoefficient: z.number(), momentSlopePerRad: z.number() })
      .nullable(),
    conventions: text(500).describe("The convention of the study's numbers"),
    dataset: z
      .strictObject({
        name: text(200),
        fileSha256: sha256.describe("SHA-256 of the uploaded file as received"),
        deliveredConvention: z.strictObject({ abscissa: text(40), normalisation: text(40), signConvention: text(40) }),
        meanAngleDeg: z.number().describe("Mean angle of attack of the tests, degrees, nose-up positive"),
        facility: text(1000).nullable(),
        modelScale: z.number().nullable().describe("Length-scale denominator (60 for 1:60)"),
        flow: z.enum(["smooth", "turbulent"]),
        turbulenceIntensityPct: z.number().nullable(),
        reynoldsNumber: z.number().nullable().describe("On the deck width B"),
        testDate: z.iso.date().nullable(),
      })
      .nullable()
      .describe("The uploaded data set the table was copied from, with its provenance; null for theory or a table typed in"),
  }),
  sweep: z.strictObject({
    fromMps: z.number().nonnegative().describe("First speed, m/s"),
    toMps: positive("Last speed, m/s"),
    stepMps: positive("Grid step, m/s (refined locally near critical points)"),
  }),
});

export const summaryChangesSchema = z.strictObject({
  since: z
    .strictObject({ summaryId: id, revisionNumber: z.number().int().positive(), contentHash: sha256, signedAt: time("When it was signed") })
    .nullable()
    .describe("The study's previously signed revision; null when this is its first signed one"),
  items: z
    .array(
      z.strictObject({
        path: text(300).describe("JSON path in the study document"),
        label: text(300).describe("The field as an engineer names it"),
        kind: z.enum(["changed", "added", "removed"]),
        old: z.json().optional(),
        new: z.json().optional(),
      }),
    )
    .max(50),
  omitted: z.number().int().nonnegative().describe("Further changed fields not listed"),
  statement: text(1000),
});

const person = (role: string) => z.strictObject({ name: text(200), role: z.literal(role) });

export const summarySignoffSchema = z.strictObject({
  prepared: person("analyst").extend({ at: time("When the revision was computed and stored") }),
  checked: person("reviewer").extend({ submittedAt: time("When it was submitted for checking"), at: time("When the check ended") }),
  approved: z.strictObject({ name: text(200), at: time("When it was approved"), by: text(200).describe("How it was approved") }),
});

export const summaryPayloadSchema = z.strictObject({
  format: z.literal(SUMMARY_FORMAT),
  project: z.strictObject({ id, name: text(200) }),
  alternative: z.strictObject({ id, name: text(200) }),
  study: z.strictObject({ id, name: text(200) }),
  revision: z.strictObject({
    id,
    number: z.number().int().positive().describe("Revision number within the study (1, 2, …)"),
    contentHash: sha256.describe("SHA-256 over the RFC 8785 canonical JSON of the study document"),
    createdAt: time("When the revision was computed and stored"),
    changeNote: z.string().max(2000).describe("The analyst's note on what changed and why (empty for revision 1)"),
  }),
  engineVersion: text(40).describe("Version of the engine that computed the result"),
  inputs: summaryInputsSchema,
  assessmentId: id.describe("The stored assessment this summary states"),
  assessment: assessmentSchema,
  changes: summaryChangesSchema,
  signoff: summarySignoffSchema,
  signer: z.strictObject({ name: text(200), email: z.email() }),
  signedAt: time("Signing time, UTC"),
  statement: text(4000).describe("The reviewer's statement, in the reviewer's words"),
});

export type SummaryPayload = z.infer<typeof summaryPayloadSchema>;
export type SummaryInputs = z.infer<typeof summaryInputsSchema>;
export type SummaryChanges = z.infer<typeof summaryChangesSchema>;

/** Any signed summary this server can verify and display: the current format or an earlier one. */
export const signedSummaryPayloadSchema = z.discriminatedUnion("format", [summaryPayloadSchema, summaryPayloadV1Schema]);
export type SignedSummaryPayload = z.infer<typeof signedSummaryPayloadSchema>;

/** The cautions every rendering of a summary carries (page, PDF, e-mail that mentions results). */
export const SUMMARY_CAUTIONS = [
  "Results are indicative.",
  "Flutter derivatives must come from tests on the actual deck section; thin-plate and quasi-steady theory can " +
    "be unconservative for bluff decks, and extrapolation beyond the tested reduced velocities is unreliable.",
  "Critical designs need wind-tunnel verification and review by a licensed engineer under the governing local " +
    "codes and standards.",
] as const;
