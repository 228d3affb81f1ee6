import { Router } from "express";
import { projectPatchSchema } from "../../shared/schemas/projects.js";
import type { AppContext } from "../app-context.js";
import { ANY_ROLE, currentUser, fromParam, parseProjectId, requireAuth, requireRole } from "../middleware/auth.js";
import { getProject, getProjectMembers, listProjects, updateProject } from "../services/projects.js";

/** /api/projects: list, read, edit (analysts), members. */
export function projectRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.get("/", async (req, res) => {
    res.json(await listProjects(db, currentUser(req)));
  });

  router.get("/:projectId", requireRole(fromParam(), ANY_ROLE), async (req, res) => {
    res.json(await getProject(db, currentUser(req), parseProjectId(fromParam()(req))));
  });

  router.patch("/:projectId", requireRole(fromParam(), ["analyst"]), async (req, res) => {
    const patch = projectPatchSchema.parse(req.body ?? {});
    res.json(await updateProject(db, currentUser(req), parseProjectId(fromParam()(req)), patch, req.ip));
  });

  router.get("/:projectId/members", requireRole(fromParam(), ANY_ROLE), async (req, res) => {
    res.json(await getProjectMembers(db, currentUser(req), parseProjectId(fromParam()(req))));
  });

  return router;
}
