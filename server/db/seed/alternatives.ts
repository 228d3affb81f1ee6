import { DERIVATIVE_NAMES } from "../../../shared/schemas/study.js";
import type { DatasetMetaInput } from "../../../shared/schemas/datasets.js";
import { createAlternative } from "../../services/alternatives.js";
import type { SessionUser } from "../../services/auth.js";
import { uploadDataset } from "../../services/datasets.js";
import { findUserById } from "../queries/users.js";
import { ref, type SeedContext, type SeedStep } from "./types.js";

/**
 * INVENTED flutter derivatives for the demo, in the study convention (forces on B, h and L downward), at
 * Ur = U/(fB) = 2 … 16. Shaped to look like section-model results of two closed steel boxes — H1* < 0, A1* > 0,
 * A3* > 0, A2* < 0 — with the single box with wind screens (alternative B) the bluffer: its A2* turns slightly
 * positive above Ur ≈ 14.5. Not measured data and not from any real deck.
 */
const UR = [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16];

const TWIN_BOX: Record<(typeof DERIVATIVE_NAMES)[number], number[]> = {
  H1: [-0.94, -1.46, -2.01, -2.6, -3.21, -3.86, -4.52, -5.22, -5.93, -6.66, -7.41, -8.17, -8.95, -9.73, -10.53],
  H2: [-0.57, -0.81, -1.0, -1.15, -1.24, -1.27, -1.25, -1.18, -1.06, -0.89, -0.67, -0.41, -0.11, 0.23, 0.61],
  H3: [-0.35, -0.8, -1.46, -2.33, -3.44, -4.79, -6.39, -8.25, -10.37, -12.77, -15.45, -18.41, -21.65, -25.17, -28.99],
  H4: [0.86, 0.77, 0.66, 0.54, 0.41, 0.28, 0.15, 0.01, -0.12, -0.25, -0.38, -0.51, -0.63, -0.75, -0.87],
  A1: [0.23, 0.36, 0.5, 0.65, 0.8, 0.96, 1.13, 1.3, 1.48, 1.66, 1.85, 2.04, 2.23, 2.43, 2.63],
  A2: [-0.078, -0.134, -0.205, -0.294, -0.4, -0.526, -0.67, -0.832, -1.011, -1.208, -1.419, -1.647, -1.888, -2.143, -2.411],
  A3: [0.127, 0.234, 0.389, 0.596, 0.859, 1.178, 1.557, 1.997, 2.501, 3.069, 3.703, 4.404, 5.171, 6.007, 6.911],
  A4: [0.018, 0.037, 0.059, 0.084, 0.111, 0.138, 0.166, 0.194, 0.222, 0.249, 0.276, 0.303, 0.328, 0.353, 0.378],
};

const SINGLE_BOX: Record<(typeof DERIVATIVE_NAMES)[number], number[]> = {
  H1: [-0.78, -1.21, -1.67, -2.15, -2.67, -3.21, -3.76, -4.34, -4.94, -5.55, -6.17, -6.8, -7.45, -8.1, -8.77],
  H2: [-0.43, -0.61, -0.75, -0.86, -0.93, -0.95, -0.94, -0.88, -0.79, -0.67, -0.5, -0.31, -0.08, 0.18, 0.46],
  H3: [-0.38, -0.88, -1.61, -2.58, -3.8, -5.29, -7.06, -9.12, -11.47, -14.12, -17.08, -20.34, -23.92, -27.82, -32.04],
  H4: [0.57, 0.51, 0.44, 0.36, 0.27, 0.19, 0.1, 0.01, -0.08, -0.17, -0.25, -0.34, -0.42, -0.5, -0.58],
  A1: [0.22, 0.34, 0.47, 0.61, 0.76, 0.91, 1.07, 1.23, 1.4, 1.57, 1.75, 1.93, 2.11, 2.3, 2.48],
  A2: [-0.043, -0.073, -0.112, -0.16, -0.218, -0.271, -0.301, -0.31, -0.295, -0.259, -0.198, -0.114, -0.006, 0.127, 0.285],
  A3: [0.141, 0.26, 0.432, 0.662, 0.954, 1.309, 1.73, 2.219, 2.779, 3.41, 4.114, 4.893, 5.745, 6.674, 7.679],
  A4: [0.014, 0.029, 0.047, 0.067, 0.088, 0.11, 0.133, 0.155, 0.178, 0.199, 0.221, 0.242, 0.262, 0.282, 0.302],
};

/** A CSV as a section-model laboratory might deliver it; `scale` turns our values into the delivered form. */
function derivativeCsv(values: typeof TWIN_BOX, scale: number): Buffer {
  const lines = [`Ur,${DERIVATIVE_NAMES.join(",")}`];
  UR.forEach((ur, i) => lines.push([ur, ...DERIVATIVE_NAMES.map((n) => +(values[n][i] * scale).toFixed(4))].join(",")));
  return Buffer.from(`${lines.join("\n")}\n`, "utf8");
}

export const DEMO_ALTERNATIVES = {
  twin: {
    name: "A — twin steel box with central gap (invented)",
    description:
      "INVENTED DEMO ALTERNATIVE. Two streamlined steel boxes joined by cross-girders every 18 m, 9.4 m open gap " +
      "between them; 37.4 m overall width, 3.5 m deep.",
    deckWidthM: 37.4,
    deckDepthM: 3.5,
  },
  single: {
    name: "B — single streamlined box with wind screens (invented)",
    description:
      "INVENTED DEMO ALTERNATIVE. One orthotropic steel box with sharp fairings and 2.5 m porous wind screens on " +
      "both edges; 29.6 m wide, 3.1 m deep.",
    deckWidthM: 29.6,
    deckDepthM: 3.1,
  },
} as const;

const provenance = (notes: string) => ({
  facility: "Invented boundary-layer wind tunnel of the demo (not a real laboratory), forced-vibration section-model rig",
  modelScale: 60,
  reynoldsNumber: 1.1e5,
  turbulenceIntensityPct: null,
  flow: "smooth" as const,
  testDate: "2026-09-17",
  notes: `INVENTED DEMO DATA — not measured. ${notes}`,
});

export async function seedUser(ctx: SeedContext, key: string): Promise<SessionUser> {
  const user = await findUserById(ctx.tx, ref(ctx, key));
  if (!user) throw new Error(`seed: no ${key}`);
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

/**
 * The demo crossing's two deck alternatives, each with one invented flutter-derivative set uploaded through
 * the same service as the API (CSV reader, convention conversion, original file kept with its SHA-256).
 * Alternative B's set is delivered in the 2B normalisation (values half of ours) to show the conversion.
 * Ids under "alternative:twin", "alternative:single", "dataset:twin", "dataset:single".
 */
export const demoAlternatives: SeedStep = {
  name: "demo alternatives and flutter derivatives",
  async run(ctx) {
    const analyst = await seedUser(ctx, "user:analyst");
    const projectId = ref(ctx, "project:harrowmere");
    const sets: { key: "twin" | "single"; values: typeof TWIN_BOX; meta: DatasetMetaInput; scale: number }[] = [
      {
        key: "twin",
        values: TWIN_BOX,
        scale: 1,
        meta: {
          kind: "flutter-derivatives",
          name: "Section model 1:60, smooth flow, 0° (invented)",
          meanAngleDeg: 0,
          convention: { abscissa: "Ur", normalisation: "B", sign: "h-down" },
          provenance: provenance("Delivered in the study convention."),
        },
      },
      {
        key: "single",
        values: SINGLE_BOX,
        scale: 0.5,
        meta: {
          kind: "flutter-derivatives",
          name: "Section model 1:60 with screens, smooth flow, 0° (invented)",
          meanAngleDeg: 0,
          convention: { abscissa: "Ur", normalisation: "2B", sign: "h-down" },
          provenance: provenance("Delivered in the 2B / 2B² normalisation: the stored converted values are twice the delivered ones."),
        },
      },
    ];
    for (const set of sets) {
      const alternative = await createAlternative(ctx.tx, analyst, projectId, { ...DEMO_ALTERNATIVES[set.key] });
      ctx.refs.set(`alternative:${set.key}`, Number(alternative.id));
      const dataset = await uploadDataset(ctx.tx, analyst, Number(alternative.id), {
        metaField: JSON.stringify(set.meta),
        file: { buffer: derivativeCsv(set.values, set.scale), originalname: `invented-${set.key}-box-derivatives.csv` },
      });
      ctx.refs.set(`dataset:${set.key}`, Number(dataset.id));
    }
  },
};
