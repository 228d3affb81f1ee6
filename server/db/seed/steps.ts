import { demoAccounts } from "./accounts.js";
import { demoAlternatives } from "./alternatives.js";
import { demoCriteria } from "./criteria.js";
import { demoProject } from "./projects.js";
import { demoReview } from "./review.js";
import { demoStudies } from "./studies.js";
import type { SeedStep } from "./types.js";

/**
 * The demo seed, in order. Later features append their own step files here (studies, revisions, signed
 * summaries); each step reads earlier ids through `ref(ctx, key)`. `demoReview` stays last: it signs a revision of
 * the demo study the studies' steps create.
 */
export const DEMO_SEED_STEPS: SeedStep[] = [
  demoAccounts,
  demoProject,
  demoCriteria,
  demoAlternatives,
  demoStudies,
  demoReview,
];
