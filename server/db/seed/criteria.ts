import type { ProjectCriteria } from "../../../shared/schemas/criteria.js";
import { saveProjectCriteria } from "../../services/criteria.js";
import { seedUser } from "./alternatives.js";
import { ref, type SeedStep } from "./types.js";

/** Every basis below names this invented document: the demo's own design basis, not a standard. */
const DESIGN_BASIS = "Harrowmere Crossing design basis, invented for the demo";

/**
 * Design wind of the invented Harrowmere crossing, matching its site notes: v_b = 28 m/s (50-year), open sea
 * (category 0), deck at 62 m → v_m ≈ 43.4 m/s at deck level. The factors are the usual ones; each basis cites the
 * crossing's (invented) design basis, so the demo's signed summary quotes no default text. Invented figures and
 * wording for the demo only.
 */
const DEMO_CRITERIA: ProjectCriteria = {
  wind: {
    basicSpeed: 28,
    probability: { kind: "return-period", years: 50 },
    terrain: { kind: "category", category: "0" },
    deckHeight: 62,
    orographyFactor: 1,
  },
  requirements: {
    flutter: {
      factor: 1.2,
      basis: `${DESIGN_BASIS}, clause 7.3.1: flutter speed at least 1.2 × the design mean wind at deck level`,
    },
    divergence: {
      factor: 2,
      basis: `${DESIGN_BASIS}, clause 7.3.2: torsional divergence speed at least 2 × the design mean wind at deck level`,
    },
    vortexOnset: {
      factor: 1.25,
      basis: `${DESIGN_BASIS}, clause 7.4.1: vortex-shedding onset below 1.25 × the design mean wind calls for amplitudes and deck accelerations`,
    },
    gallopingOnset: {
      factor: 1.25,
      basis: `${DESIGN_BASIS}, clause 7.4.2: galloping onset at least 1.25 × the design mean wind at deck level`,
    },
  },
  notes:
    "INVENTED DEMO — the requirements cite the crossing's invented design basis (clauses 7.3–7.4), agreed for the demo " +
    "between the owner's representative and the checking engineer. A real project cites its owner's specification " +
    "and the National Annex in force.",
};

/**
 * Version 1 of the demo crossing's criteria, saved by the demo reviewer (reviewers own the criteria) through the
 * same service as the API: every basis is the crossing's own text, so each is recorded as written by the reviewer.
 */
export const demoCriteria: SeedStep = {
  name: "demo criteria",
  async run(ctx) {
    const reviewer = await seedUser(ctx, "user:reviewer");
    await saveProjectCriteria(ctx.tx, reviewer, ref(ctx, "project:harrowmere"), { criteria: DEMO_CRITERIA, baseVersion: null });
  },
};
