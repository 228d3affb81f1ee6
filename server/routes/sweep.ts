import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { requestSweeps } from "../lib/request-sweeps.js";
import { sendStepsTable } from "../lib/send-steps-table.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import { sweepStudy, sweepStudyTable } from "../services/sweep.js";

/**
 * /api/sweep: POST a `stillspan.study/1` document (body ≤ 1 MB, the app's JSON limit), get the sweep result with
 * thinned branches; POST the same document to /steps.csv or /steps.json for the full step table as a download.
 */
export function sweepRoutes({ db, sweeps }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.post("/", async (req, res) => {
    const user = currentUser(req);
    res.json(await sweepStudy(db, requestSweeps(sweeps, user, res), user, req.body));
  });
  for (const format of ["csv", "json"] as const) {
    router.post(`/steps.${format}`, async (req, res) => {
      const user = currentUser(req);
      const source = await sweepStudyTable(db, requestSweeps(sweeps, user, res), user, req.body);
      await sendStepsTable(req, res, source, format);
    });
  }

  return router;
}
