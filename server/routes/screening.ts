import { Router } from "express";
import { screeningRequestSchema } from "../../shared/schemas/criteria.js";
import type { AppContext } from "../app-context.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import { screen } from "../services/screening.js";

/** /api/screening: vortex-shedding, galloping and divergence screening of a study (analysts, reviewers, admins). */
export function screeningRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.post("/", async (req, res) => {
    const request = screeningRequestSchema.parse(req.body ?? {});
    res.json(await screen(db, currentUser(req), request));
  });

  return router;
}
