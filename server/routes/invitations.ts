import { Router } from "express";
import { acceptInvitationSchema, createInvitationSchema } from "../../shared/schemas/invitations.js";
import type { AppContext } from "../app-context.js";
import { currentUser, fromParam, requireAdmin, requireAuth } from "../middleware/auth.js";
import { parseProjectId } from "../services/access.js";
import { acceptInvitation, inviteToProject } from "../services/one-time-links.js";

/** /api/projects/:projectId/invitations (administrators): invite someone to a project by e-mail. */
export function projectInvitationRoutes(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.post("/", requireAuth, requireAdmin, async (req, res) => {
    const input = createInvitationSchema.parse(req.body ?? {});
    const projectId = parseProjectId(fromParam()(req));
    res.status(201).json(await inviteToProject(ctx, currentUser(req), projectId, input, req.ip));
  });
  return router;
}

/** /api/invitations/accept: the one-time link's page posts the token, a password and the name here (no session). */
export function invitationRoutes(ctx: AppContext): Router {
  const router = Router();
  router.post("/accept", async (req, res) => {
    const input = acceptInvitationSchema.parse(req.body ?? {});
    res.json(await acceptInvitation(ctx, input, req.ip));
  });
  return router;
}
