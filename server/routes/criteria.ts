import { Router } from "express";
import { putCriteriaBodySchema } from "../../shared/schemas/criteria.js";
import type { AppContext } from "../app-context.js";
import { currentUser, fromParam, requireAuth, requireRole } from "../middleware/auth.js";
import { ANY_ROLE, parseProjectId } from "../services/access.js";
import { CRITERIA_OWNER_ROLES, getProjectCriteria, getProjectCriteriaHistory, saveProjectCriteria } from "../services/criteria.js";

/** /api/projects/:projectId/criteria: read (members), save a new version (reviewers and administrators, the criteria owners), history (members). */
export function criteriaRoutes({ db }: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const projectId = fromParam();

  router.get("/", requireRole(projectId, ANY_ROLE), async (req, res) => {
    res.json(await getProjectCriteria(db, currentUser(req), parseProjectId(projectId(req))));
  });

  router.put("/", requireRole(projectId, CRITERIA_OWNER_ROLES), async (req, res) => {
    const body = putCriteriaBodySchema.parse(req.body ?? {});
    res.json(await saveProjectCriteria(db, currentUser(req), parseProjectId(projectId(req)), body, req.ip));
  });

  router.get("/history", requireRole(projectId, ANY_ROLE), async (req, res) => {
    res.json(await getProjectCriteriaHistory(db, currentUser(req), parseProjectId(projectId(req))));
  });

  return router;
}
