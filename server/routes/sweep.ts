import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import { sweepStudy } from "../services/sweep.js";

/** /api/sweep: POST a `stillspan.study/1` document, get the sweep result (body ≤ 1 MB, the app's JSON limit). */
export function sweepRoutes({ db }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.post("/", async (req, res) => {
    res.json(await sweepStudy(db, currentUser(req), req.body));
  });

  return router;
}
