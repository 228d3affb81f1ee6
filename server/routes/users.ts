import { Router } from "express";
import { userPatchSchema } from "../../shared/schemas/users.js";
import type { AppContext } from "../app-context.js";
import { currentUser, requireAdmin, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import { listUsers, updateUser } from "../services/users.js";

/** /api/users: account administration (administrators only). */
export function userRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth, requireAdmin);

  router.get("/", async (req, res) => {
    res.json(await listUsers(db, currentUser(req)));
  });

  router.patch("/:userId", async (req, res) => {
    const userId = parseObjectId(req.params.userId, "User");
    const patch = userPatchSchema.parse(req.body ?? {});
    res.json(await updateUser(db, currentUser(req), { userId, patch, ip: req.ip }));
  });

  return router;
}
