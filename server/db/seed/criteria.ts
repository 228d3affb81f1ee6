import { DEFAULT_REQUIREMENTS } from "../../../shared/criteria/default-requirements.js";
import type { ProjectCriteria } from "../../../shared/schemas/criteria.js";
import { projectCriteria } from "../schema/index.js";
import { ref, type SeedStep } from "./types.js";

/**
 * Design wind of the invented Harrowmere crossing, matching its site notes: v_b = 28 m/s (50-year), open sea
 * (category 0), deck at 62 m → v_m ≈ 43.4 m/s at deck level. Invented figures for the demo only.
 */
export const DEMO_CRITERIA: ProjectCriteria = {
  wind: {
    basicSpeed: 28,
    probability: { kind: "return-period", years: 50 },
    terrain: { kind: "category", category: "0" },
    deckHeight: 62,
    orographyFactor: 1,
  },
  requirements: DEFAULT_REQUIREMENTS,
  notes:
    "INVENTED DEMO — factors are the defaults (EN 1991-1-4 Annex E, from memory; 1.2 on flutter, common in bridge " +
    "specifications). Replace with the owner's specification and the National Annex.",
};

/** Version 1 of the demo crossing's criteria, saved by the demo analyst. */
export const demoCriteria: SeedStep = {
  name: "demo criteria",
  async run(ctx) {
    await ctx.tx.insert(projectCriteria).values({
      projectId: ref(ctx, "project:harrowmere"),
      version: 1,
      criteria: DEMO_CRITERIA,
      createdBy: ref(ctx, "user:analyst"),
    });
  },
};
