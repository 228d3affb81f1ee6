import { Router } from "express";
import type { AppContext } from "../app-context.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import { getSummary, getSummaryPdf, listSummaries } from "../services/summaries.js";

/** /api/summaries: signed stability summaries of the caller's projects (viewers included), their PDF copies. */
export function summaryRoutes({ db, config }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);

  router.get("/", async (req, res) => {
    res.json(await listSummaries(db, currentUser(req)));
  });

  router.get("/:id", async (req, res) => {
    res.json(await getSummary(db, config, currentUser(req), parseObjectId(req.params.id, "Signed summary")));
  });

  router.get("/:id/pdf", async (req, res) => {
    const { pdf, fileName } = await getSummaryPdf(db, config, currentUser(req), parseObjectId(req.params.id, "Signed summary"));
    res.setHeader("Content-Type", "application/pdf");
    res.setHeader("Content-Disposition", `attachment; filename="${fileName}"`);
    res.setHeader("Cache-Control", "private, no-store");
    res.send(pdf);
  });

  return router;
}
