import { Router, type Request } from "express";
import { userPatchSchema } from "../../shared/schemas/users.js";
import type { AppContext } from "../app-context.js";
import { AppError } from "../errors.js";
import { currentUser, fromParam, requireAdmin, requireAuth } from "../middleware/auth.js";
import { listUsers, updateUser } from "../services/users.js";

/** A user id from the URL (`:userId`); anything but a positive integer is a user that does not exist. */
export function parseUserId(req: Request): number {
  const raw = fromParam("userId")(req) ?? "";
  if (!/^\d{1,9}$/.test(raw) || Number(raw) <= 0) throw AppError.notFound("User");
  return Number(raw);
}

/** /api/users: account administration (administrators only). */
export function userRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth, requireAdmin);

  router.get("/", async (req, res) => {
    res.json(await listUsers(db, currentUser(req)));
  });

  router.patch("/:userId", async (req, res) => {
    const userId = parseUserId(req);
    const patch = userPatchSchema.parse(req.body ?? {});
    res.json(await updateUser(db, currentUser(req), { userId, patch, ip: req.ip }));
  });

  return router;
}
