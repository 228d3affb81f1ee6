import { memberships, projects } from "../schema/index.js";
import { ref, type SeedStep } from "./types.js";

/** Fictional crossing for the demo. Every figure here is invented; none comes from a real bridge or benchmark. */
export const DEMO_PROJECT = {
  name: "Harrowmere Estuary Crossing (invented demo)",
  description:
    "INVENTED DEMO PROJECT — not a real bridge. A cable-supported road crossing of the fictional Harrowmere " +
    "estuary: a 1,180 m main span between two A-frame towers, with two deck alternatives under study — a " +
    "streamlined single steel box and a twin-box with a central gap. The study question: does each alternative " +
    "stay free of flutter and torsional divergence well above the design wind speed at deck level?",
  siteNotes:
    "Invented site data for demonstration only. Deck at about 62 m above mean high water; open-water fetch of " +
    "14 km from the south-west (the governing sector). Assumed basic wind speed 28 m/s (10 min mean at 10 m, " +
    "50-year return), sea terrain (z0 = 0.003 m); by the EN 1991-1-4 logarithmic profile (c_r ≈ 1.55 at 62 m) " +
    "the design mean wind speed at deck level is about 43.4 m/s. " +
    "Section-model tests are planned in a boundary-layer wind tunnel at 1:60 scale; until then, flutter " +
    "derivatives come from the thin-plate model.",
} as const;

/** The demo crossing and its three memberships; id under "project:harrowmere". */
export const demoProject: SeedStep = {
  name: "demo project",
  async run(ctx) {
    const { tx, refs } = ctx;
    const [project] = await tx
      .insert(projects)
      .values({ ...DEMO_PROJECT, createdBy: ref(ctx, "user:admin") })
      .returning({ id: projects.id });
    refs.set("project:harrowmere", project.id);
    await tx.insert(memberships).values([
      { projectId: project.id, userId: ref(ctx, "user:analyst"), role: "analyst" },
      { projectId: project.id, userId: ref(ctx, "user:reviewer"), role: "reviewer" },
      { projectId: project.id, userId: ref(ctx, "user:viewer"), role: "viewer" },
    ]);
  },
};
