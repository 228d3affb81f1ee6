import { Router } from "express";
import { memberRoleInputSchema, projectCreateSchema, projectPatchSchema } from "../../shared/schemas/projects.js";
import type { AppContext } from "../app-context.js";
import { currentUser, fromParam, requireAdmin, requireAuth, requireRole } from "../middleware/auth.js";
import { ANY_ROLE, parseObjectId, parseProjectId } from "../services/access.js";
import { removeMember, setMember } from "../services/memberships.js";
import {
  createProject,
  deleteProject,
  getProject,
  getProjectMembers,
  listProjects,
  updateProject,
} from "../services/projects.js";

/** /api/projects: list, read, edit (analysts), members; create, delete and membership (administrators). */
export function projectRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.get("/", async (req, res) => {
    res.json(await listProjects(db, currentUser(req)));
  });

  router.post("/", requireAdmin, async (req, res) => {
    const input = projectCreateSchema.parse(req.body ?? {});
    res.status(201).json(await createProject(db, currentUser(req), input, req.ip));
  });

  router.get("/:projectId", requireRole(fromParam(), ANY_ROLE), async (req, res) => {
    res.json(await getProject(db, currentUser(req), parseProjectId(fromParam()(req))));
  });

  router.patch("/:projectId", requireRole(fromParam(), ["analyst"]), async (req, res) => {
    const patch = projectPatchSchema.parse(req.body ?? {});
    res.json(await updateProject(db, currentUser(req), parseProjectId(fromParam()(req)), patch, req.ip));
  });

  router.delete("/:projectId", requireAdmin, async (req, res) => {
    await deleteProject(db, currentUser(req), parseProjectId(fromParam()(req)), req.ip);
    res.status(204).end();
  });

  router.get("/:projectId/members", requireRole(fromParam(), ANY_ROLE), async (req, res) => {
    res.json(await getProjectMembers(db, currentUser(req), parseProjectId(fromParam()(req))));
  });

  router.put("/:projectId/members/:userId", requireAdmin, async (req, res) => {
    const projectId = parseProjectId(fromParam()(req));
    const userId = parseObjectId(req.params.userId, "User");
    const input = memberRoleInputSchema.parse(req.body ?? {});
    const { member, created } = await setMember(db, currentUser(req), { projectId, userId, input, ip: req.ip });
    res.status(created ? 201 : 200).json(member);
  });

  router.delete("/:projectId/members/:userId", requireAdmin, async (req, res) => {
    const projectId = parseProjectId(fromParam()(req));
    await removeMember(db, currentUser(req), { projectId, userId: parseObjectId(req.params.userId, "User"), ip: req.ip });
    res.status(204).end();
  });

  return router;
}
