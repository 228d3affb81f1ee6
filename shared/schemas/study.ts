/**
 * The study document `stillspan.study/1`: one deck section model (2 DOF) with its structure, its
 * aerodynamics and the wind-speed sweep. Units are SI throughout; each numeric field's `.describe()` names
 * its unit. Conventions (docs/conventions.md §Self-excited forces): Scanlan's self-excited forces normalised with the full deck width
 * B, K = Bω/U, Ur = U/(fB) = 2π/K, h and L positive downward, α and M nose-up.
 *
 * Messages are plain rule text ("must be greater than 0"); `formatStudyIssues` pairs each with the JSON path
 * of the offending value ("$.structure.modes[1].frequency").
 */
import { z } from "zod";
import { capList, clipValue } from "../message-bounds";
import { normalNumber, userText, zeroOrAtLeast } from "./input-rules";

export const STUDY_FORMAT = "stillspan.study/1";
/** Limits of the deck width B and depth D, m — shared with a deck alternative's B and D (shared/schemas/alternatives.ts). */
export const DECK_WIDTH_LIMITS_M = { min: 0.01, max: 1000 } as const;
export const DECK_DEPTH_LIMITS_M = { min: 0.001, max: 1000 } as const;

/** Largest number of sweep intervals ((to − from) / step) a study may ask for. */
export const MAX_SWEEP_STEPS = 20_000;

/**
 * Most rows of a derivative table (here, and in an uploaded CSV file). Measured tables hold tens of rows; the
 * cap keeps every table far below sizes that overflow argument lists or make interpolation and diffs slow.
 */
export const MAX_TABLE_ROWS = 10_000;

/** Range of the reduced velocity Ur = U/(fB) of a derivative table (also applied to uploaded data sets). */
export const REDUCED_VELOCITY_LIMITS = { min: 0.01, max: 1000 } as const;
/** Largest magnitude of a flutter derivative (a larger one is a typing or unit error). */
export const MAX_DERIVATIVE_MAGNITUDE = 100_000;
/** Largest structural damping ratio accepted: above it the value is almost surely a percentage typed as a ratio. */
export const MAX_DAMPING_RATIO = 0.2;
/** Damping ratios above this are accepted but unusual for a bridge deck: the study form warns. */
export const HIGH_DAMPING_RATIO = 0.05;

const typeError = (expected: string) => (issue: { input?: unknown }) =>
  issue.input === undefined ? "is required" : `must be ${expected}`;

/** A finite, not denormal number (shared/schemas/input-rules.ts) with its unit in the description. */
const number = (description: string) => normalNumber({ error: typeError("a number") }).describe(description);
const positive = (description: string) => number(description).positive({ error: "must be greater than 0" });
/**
 * A positive number within a plausible range. The bounds are wide — they hold section models at small scale and
 * the largest decks at full scale — and keep the eigenproblem well away from the magnitudes where it cannot
 * converge (a mass of 1e-300 kg/m or a width of 1e200 m left the solver iterating without end).
 */
const bounded = (description: string, min: number, max: number, unit: string) => {
  const base = min > 0 ? positive(description) : number(description).min(min, { error: `must be at least ${min}` });
  return (min > 0 ? base.refine((v) => !(v > 0 && v < min), { error: `must be at least ${min}${unit}` }) : base)
    .refine((v) => !(v > max), { error: `must be at most ${max}${unit}` });
};

const object = <T extends z.ZodRawShape>(shape: T) =>
  z.strictObject(shape, {
    error: (issue) =>
      issue.code === "unrecognized_keys" ? "is not a field of this format" : typeError("an object")(issue),
  });

const modeSchema = object({
  id: userText({ error: typeError("a string") })
    .min(1, { error: "must have 1 to 16 characters" })
    .max(16, { error: "must have 1 to 16 characters" })
    .describe("Mode identifier, unique in the study (1–16 characters)"),
  dof: z.enum(["heave", "torsion"], { error: 'must be "heave" or "torsion"' }).describe("Degree of freedom"),
  frequency: bounded("Natural frequency in still air, Hz", 0.001, 1000, " Hz"),
  damping: zeroOrAtLeast(
    number("Structural damping ratio of critical, dimensionless (0.005 = 0.5 %)")
      .min(0, { error: "must be at least 0" })
      .max(MAX_DAMPING_RATIO, {
        error: (issue) =>
          `must be at most ${MAX_DAMPING_RATIO}: damping is a ratio: 0.005 is 0.5 % ` +
          `(${String(issue.input)} would be ${Number(((issue.input as number) * 100).toPrecision(6))} %)`,
      }),
    0.0001,
    "",
  ),
});

const modesSchema = z
  .array(modeSchema, { error: typeError("an array") })
  .superRefine((modes, ctx) => {
    for (const dof of ["heave", "torsion"] as const) {
      const count = modes.filter((mode) => mode.dof === dof).length;
      if (count !== 1) {
        ctx.addIssue({ code: "custom", message: `must contain exactly one ${dof} mode (found ${count})` });
      }
    }
    const seen = new Set<string>();
    modes.forEach((mode, index) => {
      if (seen.has(mode.id)) {
        ctx.addIssue({ code: "custom", path: [index, "id"], message: `must be unique ("${mode.id}" is repeated)` });
      }
      seen.add(mode.id);
    });
  });

const structureSchema = object({
  mass: bounded("Mass per unit length of deck, kg/m", 0.001, 1e8, " kg/m"),
  inertia: bounded(
    "Mass moment of inertia per unit length about the deck centre (shear centre), kg·m²/m",
    1e-9,
    1e14,
    " kg·m²/m",
  ),
  modes: modesSchema,
});

const derivativeArray = (name: string) =>
  z
    .array(
      number(`${name}, dimensionless`)
        .min(-MAX_DERIVATIVE_MAGNITUDE, { error: `must be at least -${MAX_DERIVATIVE_MAGNITUDE}` })
        .max(MAX_DERIVATIVE_MAGNITUDE, { error: `must be at most ${MAX_DERIVATIVE_MAGNITUDE}` }),
      { error: typeError("an array of numbers") },
    )
    .max(MAX_TABLE_ROWS, { error: `must have at most ${MAX_TABLE_ROWS} values` })
    .optional()
    .describe(`${name} at each reduced velocity, dimensionless, normalised with the full width B; missing = zeros`);

const DERIVATIVE_NAMES = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;

const tabulatedSchema = object({
  model: z.literal("tabulated"),
  interpolation: z
    .enum(["linear", "monotone-cubic"], { error: 'must be "linear" or "monotone-cubic"' })
    .describe("Interpolation in reduced velocity: piecewise linear or Fritsch–Carlson monotone cubic"),
  reducedVelocity: z
    .array(
      bounded(
        "Reduced velocity Ur = U/(fB), dimensionless",
        REDUCED_VELOCITY_LIMITS.min,
        REDUCED_VELOCITY_LIMITS.max,
        "",
      ),
      { error: typeError("an array of numbers") },
    )
    .min(2, { error: "must have at least 2 points" })
    .max(MAX_TABLE_ROWS, { error: `must have at most ${MAX_TABLE_ROWS} points` })
    .describe("Reduced velocities Ur = U/(fB) of the table rows, dimensionless, strictly increasing"),
  H1: derivativeArray("H1*"),
  H2: derivativeArray("H2*"),
  H3: derivativeArray("H3*"),
  H4: derivativeArray("H4*"),
  A1: derivativeArray("A1*"),
  A2: derivativeArray("A2*"),
  A3: derivativeArray("A3*"),
  A4: derivativeArray("A4*"),
  staticMomentSlope: bounded(
    "Static moment slope dC_M/dα, per radian, moment coefficient on ½ρU²B²; default K²A3* at the largest Ur",
    -100,
    100,
    " per rad",
  ).optional(),
}).superRefine((table, ctx) => {
  const ur = table.reducedVelocity;
  for (let i = 1; i < ur.length; i++) {
    if (!(ur[i] > ur[i - 1])) {
      ctx.addIssue({
        code: "custom",
        path: ["reducedVelocity", i],
        message: `must be greater than the previous value ${ur[i - 1]} (reduced velocities must increase strictly)`,
      });
    }
  }
  for (const name of DERIVATIVE_NAMES) {
    const values = table[name];
    if (values !== undefined && values.length !== ur.length) {
      ctx.addIssue({
        code: "custom",
        path: [name],
        message: `must have as many values as reducedVelocity (${ur.length}), has ${values.length}`,
      });
    }
  }
});

const flatPlateSchema = object({ model: z.literal("flat-plate") });

const quasiSteadySchema = object({
  model: z.literal("quasi-steady"),
  liftSlope: bounded("Lift coefficient slope dC_L/dα, per radian, lift positive up, coefficient on ½ρU²B", -100, 100, " per rad"),
  dragCoefficient: zeroOrAtLeast(bounded("Drag coefficient C_D on ½ρU²B, dimensionless", 0, 10, ""), 0.0001, ""),
  momentSlope: bounded("Moment coefficient slope dC_M/dα, per radian, nose-up, coefficient on ½ρU²B²", -100, 100, " per rad"),
});

export const studyAerodynamicsSchema = z.discriminatedUnion(
  "model",
  [tabulatedSchema, flatPlateSchema, quasiSteadySchema],
  {
    error: (issue) =>
      issue.input === undefined || typeof issue.input !== "object" || issue.input === null
        ? typeError("an object")(issue)
        : 'must have "model" set to "tabulated", "flat-plate" or "quasi-steady"',
  },
);

const sweepSchema = object({
  // Speeds below 1 cm/s and steps below 1 mm/s mean nothing for wind, and a tiny speed makes K = Bω/U overflow.
  from: zeroOrAtLeast(number("First mean wind speed at deck level, m/s").min(0, { error: "must be at least 0" }), 0.01, " m/s"),
  to: bounded("Last mean wind speed at deck level, m/s", 0.01, 500, " m/s"),
  step: bounded("Wind-speed step, m/s", 0.001, 500, " m/s"),
}).superRefine((sweep, ctx) => {
  if (!(sweep.from < sweep.to)) {
    ctx.addIssue({ code: "custom", path: ["to"], message: `must be greater than from (${sweep.from})` });
    return;
  }
  const span = sweep.to - sweep.from;
  if (!(sweep.step > 0)) return; // already refused as "must be greater than 0"; no step count to give
  if (sweep.step > span) {
    ctx.addIssue({ code: "custom", path: ["step"], message: `must be at most to − from (${span})` });
  } else if (sweepStepCount(sweep) > MAX_SWEEP_STEPS) {
    ctx.addIssue({
      code: "custom",
      path: ["step"],
      message: `must give at most ${MAX_SWEEP_STEPS} steps between from and to (gives ${sweepStepCount(sweep)})`,
    });
  }
});

/** Number of sweep intervals, ceil((to − from)/step), with a relative tolerance for decimal steps. */
export function sweepStepCount(sweep: { from: number; to: number; step: number }): number {
  return Math.ceil((sweep.to - sweep.from) / sweep.step - 1e-9);
}

export const studyDocumentSchema = object({
  format: z.literal(STUDY_FORMAT, { error: `must be "${STUDY_FORMAT}"` }),
  name: userText({ error: typeError("a string") })
    .max(200, { error: "must have at most 200 characters" })
    .refine((name) => name.trim().length > 0, { error: "must not be blank" })
    .describe("Name of the study, e.g. the deck alternative and revision"),
  air: object({ density: zeroOrAtLeast(bounded("Air density, kg/m³ (0 = still-air check)", 0, 5, " kg/m³"), 0.01, " kg/m³") }),
  deck: object({
    width: bounded("Deck width B (the reference length of the derivatives), m", DECK_WIDTH_LIMITS_M.min, DECK_WIDTH_LIMITS_M.max, " m"),
    depth: bounded("Deck depth, m", DECK_DEPTH_LIMITS_M.min, DECK_DEPTH_LIMITS_M.max, " m"),
  }),
  structure: structureSchema,
  aerodynamics: studyAerodynamicsSchema,
  sweep: sweepSchema,
});

export type StudyDocument = z.infer<typeof studyDocumentSchema>;
export type StudyAerodynamics = z.infer<typeof studyAerodynamicsSchema>;
export type DerivativeName = (typeof DERIVATIVE_NAMES)[number];
export { DERIVATIVE_NAMES };

/** One problem in a study document: the JSON path of the value and the rule it broke. */
export interface StudyIssue {
  path: string;
  message: string;
}

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

function jsonPath(path: readonly PropertyKey[]): string {
  let out = "$";
  for (const key of path) {
    if (typeof key === "number") out += `[${key}]`;
    // An unknown key of 1 MB is named by its first 100 characters, not repeated whole.
    else if (typeof key === "string" && IDENTIFIER.test(key)) out += `.${clipValue(key)}`;
    else out += `[${JSON.stringify(clipValue(String(key)))}]`;
  }
  return out;
}

/**
 * Turns a zod error of `studyDocumentSchema` into JSON-path issues, one per bad value (each unknown key listed
 * at its own path); at most 50, the rest counted in a last entry.
 */
export function formatStudyIssues(error: z.ZodError): StudyIssue[] {
  const issues: StudyIssue[] = [];
  for (const issue of error.issues) {
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) issues.push({ path: jsonPath([...issue.path, key]), message: issue.message });
    } else {
      issues.push({ path: jsonPath(issue.path), message: issue.message });
    }
  }
  return capList(issues, (count) => ({ path: "$", message: `… and ${count} more problems` }));
}

export type ParseStudyResult = { ok: true; study: StudyDocument } | { ok: false; issues: StudyIssue[] };

/** Validates an already JSON-decoded value as a `stillspan.study/1` document. */
export function parseStudy(json: unknown): ParseStudyResult {
  const result = studyDocumentSchema.safeParse(json);
  return result.success ? { ok: true, study: result.data } : { ok: false, issues: formatStudyIssues(result.error) };
}
