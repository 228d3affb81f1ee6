/**
 * The sweep result `runSweep` returns — the same JSON from the CLI, the API and stored revisions, except that the
 * server thins long branches and says so in `sampling` (the full step table is a separate download). Units are SI;
 * each numeric field's `.describe()` names its unit. See docs/study-format.md.
 */
import { z } from "zod";

export const WARNING_CODES = [
  "extrapolated-derivatives",
  "quasi-steady-flutter",
  "unstable-at-start",
  "pk-fold",
  "static-instability",
  "tracking-ambiguous",
  "no-convergence",
] as const;

export const flutterKindSchema = z
  .enum(["coupled", "torsional", "heave"])
  .describe("coupled when the smaller participation at the critical point is ≥ 0.1, else the dominant degree of freedom");

export const flutterSchema = z.object({
  speed: z.number().describe("Flutter speed, m/s (to 0.001 m/s)"),
  frequency: z.number().describe("Frequency of the critical pole, Hz"),
  mode: z.string().describe("Id of the structural mode the critical branch started from at the first speed"),
  reducedVelocity: z.number().describe("Ur = U/(fB) at flutter, dimensionless"),
  kind: flutterKindSchema,
  insideTestedRange: z
    .boolean()
    .nullable()
    .optional()
    .describe(
      "Whether the critical pole's own reduced velocity Ur = U/(fB) lies inside the derivative table's tested range " +
        "(true / false); null for models without a table (thin plate, quasi-steady). Absent in results stored before engine 1.1.0",
    ),
});

export const sweepStepSchema = z.object({
  speed: z.number().describe("Mean wind speed, m/s"),
  frequency: z.number().describe("Frequency Im λ / 2π, Hz (0 on a static branch)"),
  damping: z.number().describe("Damping ratio −Re λ / |λ|, dimensionless"),
  re: z.number().describe("Real part of the pole λ, rad/s"),
  im: z.number().describe("Imaginary part of the pole λ, rad/s (≥ 0)"),
  participation: z
    .record(z.string(), z.number())
    .describe("Share of each structural mode in the eigenvector's kinetic energy, summing to 1"),
  mac: z
    .number()
    .describe("Mass-weighted MAC with the same branch's previous solved step (first speed: the hidden lead-in from still air), 0–1"),
  confidence: z.number().describe("Tracker confidence in the assignment, 0–1 (docs/method-and-validation.md)"),
});

export const sweepWarningSchema = z.object({
  code: z.enum(WARNING_CODES),
  message: z.string(),
  speeds: z.array(z.number()).optional().describe("Speeds concerned, m/s (a [from, to] range for extrapolation)"),
  branch: z
    .string()
    .optional()
    .describe("extrapolated-derivatives: the structural mode id of the branch that left the tested range"),
  branches: z
    .array(z.string())
    .optional()
    .describe("static-instability: the structural mode id of the branch of each crossing in `speeds`, in the same order"),
  reducedVelocities: z
    .tuple([z.number(), z.number()])
    .optional()
    .describe(
      "extrapolated-derivatives: the branch's lowest and highest oscillating Ur = U/(fB) over the range, dimensionless " +
        "(a branch that has become a static pole has no Ur there)",
    ),
  speedCount: z
    .number()
    .int()
    .optional()
    .describe("How many speeds the warning concerns, when `speeds` lists only the first of them (server results)"),
});

/** How many of the solved steps a server result carries (docs/study-format.md, "Thinned branches"). */
export const sweepSamplingSchema = z.object({
  solvedSteps: z
    .number()
    .int()
    .describe("Speeds solved on each branch (grid and local refinement): the rows per branch of the full step table"),
  shownSteps: z.number().int().describe("Steps kept on each branch in `modes[].steps`"),
  maxShownSteps: z
    .number()
    .int()
    .describe("Most steps a branch may carry in this result (2,000; fewer when there are more than four branches)"),
  omittedWarnings: z
    .number()
    .int()
    .optional()
    .describe("Warnings left out beyond the first 50 of one code (only when some were)"),
});

export const sweepResultSchema = z.object({
  flutter: flutterSchema.nullable().describe("Lowest flutter point over every branch; null when all stay damped"),
  divergence: z
    .object({ speed: z.number().describe("Torsional divergence speed (closed form), m/s") })
    .nullable()
    .describe("Closed-form torsional divergence when it lies inside [from, to]; null when outside (see divergenceOutsideSweep) or impossible"),
  divergenceOutsideSweep: z
    .object({ speed: z.number().describe("Torsional divergence speed (closed form), m/s") })
    .nullable()
    .optional()
    .describe(
      "The same closed form when it lies outside the swept range [from, to], so a reader can still be told it; null when it " +
        "lies inside (see divergence) or divergence is impossible. Absent in results stored before engine 1.1.0",
    ),
  selberg: z.number().nullable().describe("Selberg's flutter estimate, m/s; null unless f_torsion > f_heave"),
  modes: z.array(z.object({ id: z.string(), steps: z.array(sweepStepSchema) })),
  warnings: z.array(sweepWarningSchema),
  engine: z.string().describe("Engine version that produced the result"),
  sampling: sweepSamplingSchema
    .optional()
    .describe("Server results only: how the branches were thinned. Absent when every solved step is inline (command line)"),
});

export type SweepResult = z.infer<typeof sweepResultSchema>;
export type SweepStep = z.infer<typeof sweepStepSchema>;
export type SweepWarning = z.infer<typeof sweepWarningSchema>;
export type SweepWarningCode = (typeof WARNING_CODES)[number];
export type FlutterPoint = z.infer<typeof flutterSchema>;
export type SweepSampling = z.infer<typeof sweepSamplingSchema>;
