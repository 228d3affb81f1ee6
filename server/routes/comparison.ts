import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { currentUser, fromParam, requireAuth } from "../middleware/auth.js";
import { parseProjectId } from "../services/access.js";
import { getComparison } from "../services/comparison.js";

/** /api/projects/:projectId/comparison (analysts, reviewers). */
export function comparisonRoutes({ db }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.get("/", async (req, res) => {
    res.json(await getComparison(db, currentUser(req), parseProjectId(fromParam()(req))));
  });
  return router;
}
