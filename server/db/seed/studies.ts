import type { StudyDocument } from "../../../shared/schemas/study.js";
import { findDataset } from "../queries/datasets.js";
import { saveRevision } from "../../services/revisions.js";
import { runSweepInProcess } from "../../services/sweep-compute.js";
import { createStudy } from "../../services/studies.js";
import { seedUser } from "./alternatives.js";
import { ref, type SeedContext, type SeedStep } from "./types.js";

/** A tabulated study block from a stored data set's converted values (study convention). */
async function tabulatedFrom(ctx: SeedContext, key: string): Promise<StudyDocument["aerodynamics"]> {
  const dataset = await findDataset(ctx.tx, ref(ctx, key));
  if (!dataset) throw new Error(`seed: no ${key}`);
  const c = dataset.converted as Record<string, number[]>;
  return {
    model: "tabulated",
    interpolation: "monotone-cubic",
    reducedVelocity: c.reducedVelocity,
    H1: c.H1, H2: c.H2, H3: c.H3, H4: c.H4, A1: c.A1, A2: c.A2, A3: c.A3, A4: c.A4,
  };
}

/** INVENTED structural properties of a demo deck (plausible for a ~1.2 km main span; not a real bridge). */
interface InventedDeck {
  name: string;
  widthM: number;
  depthM: number;
  massPerLengthKgM: number;
  inertiaKgM2M: number;
  heaveHz: number;
  torsionHz: number;
}

const SINGLE_BOX: InventedDeck = {
  name: "Alternative B — single box with screens, service state (invented demo)",
  widthM: 29.6,
  depthM: 3.1,
  massPerLengthKgM: 16900,
  inertiaKgM2M: 1.62e6,
  heaveHz: 0.104,
  torsionHz: 0.286,
};

const TWIN_BOX: InventedDeck = {
  name: "Alternative A — twin box, service state (invented demo)",
  widthM: 37.4,
  depthM: 3.5,
  massPerLengthKgM: 20300,
  inertiaKgM2M: 3.05e6,
  heaveHz: 0.095,
  torsionHz: 0.248,
};

/** A demo study document: the deck's two modes (0.4 % damping), the given aerodynamics, 1–120 m/s. */
function deckStudy(deck: InventedDeck, aerodynamics: StudyDocument["aerodynamics"]): StudyDocument {
  return {
    format: "stillspan.study/1",
    name: deck.name,
    air: { density: 1.225 },
    deck: { width: deck.widthM, depth: deck.depthM },
    structure: {
      mass: deck.massPerLengthKgM,
      inertia: deck.inertiaKgM2M,
      modes: [
        { id: "VS1", dof: "heave", frequency: deck.heaveHz, damping: 0.004 },
        { id: "TS1", dof: "torsion", frequency: deck.torsionHz, damping: 0.004 },
      ],
    },
    aerodynamics,
    sweep: { from: 1, to: 120, step: 0.5 },
  };
}

/**
 * The demo studies, every revision computed and stored through the same service as the API: alternative B's
 * flutter study with three revisions (a revised torsional frequency, then a heavier deck) whose critical speeds
 * differ, created first so the review step picks it; then alternative A's study with one revision.
 * Ids under "study:single", "study:twin".
 */
export const demoStudies: SeedStep = {
  name: "demo studies and revisions",
  async run(ctx) {
    const analyst = await seedUser(ctx, "user:analyst");
    const single = deckStudy(SINGLE_BOX, await tabulatedFrom(ctx, "dataset:single"));
    const studyB = await createStudy(ctx.tx, runSweepInProcess, analyst, ref(ctx, "alternative:single"), {
      name: "Flutter and divergence — alternative B",
      purpose: "INVENTED DEMO. Does the single box with wind screens stay stable well above the required speeds?",
      study: single,
    });
    ctx.refs.set("study:single", Number(studyB.id));

    const revised = structuredClone(single);
    revised.structure.modes[1].frequency = 0.271;
    await saveRevision(ctx.tx, runSweepInProcess, analyst, Number(studyB.id), {
      parentRevision: 1,
      changeNote: "Torsional frequency 0.286 → 0.271 Hz from the updated global model (cable sag stiffness revised).",
      study: revised,
    });
    const heavier = structuredClone(revised);
    heavier.structure.mass = 17650;
    heavier.structure.inertia = 1.71e6;
    await saveRevision(ctx.tx, runSweepInProcess, analyst, Number(studyB.id), {
      parentRevision: 2,
      changeNote: "Heavier surfacing (mastic asphalt 60 mm) and screen posts: m 16 900 → 17 650 kg/m, I 1.62e6 → 1.71e6 kg·m²/m.",
      study: heavier,
    });

    const studyA = await createStudy(ctx.tx, runSweepInProcess, analyst, ref(ctx, "alternative:twin"), {
      name: "Flutter and divergence — alternative A",
      purpose: "INVENTED DEMO. The twin box: reference for the comparison with alternative B.",
      study: deckStudy(TWIN_BOX, await tabulatedFrom(ctx, "dataset:twin")),
    });
    ctx.refs.set("study:twin", Number(studyA.id));
  },
};
