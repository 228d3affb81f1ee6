import { Router } from "express";
import { rerunRevisionSchema } from "../../shared/schemas/revisions.js";
import type { AppContext } from "../app-context.js";
import { requestSweeps } from "../lib/request-sweeps.js";
import { sendStepsTable } from "../lib/send-steps-table.js";
import { currentUser, requireAuth } from "../middleware/auth.js";
import { parseObjectId } from "../services/access.js";
import { revisionStepsTable } from "../services/revision-steps.js";
import { diffRevisions, exportRevision, getRevision, rerunRevision } from "../services/revisions.js";

const revisionId = (raw: string | string[] | undefined) => parseObjectId(raw, "Revision");

/**
 * /api/revisions/:id: read (document + thinned result), diff, re-run with the current engine, export, and the
 * full step table as a CSV or JSON download (steps.csv, steps.json).
 */
export function revisionRoutes({ db, sweeps }: AppContext): Router {
  const router = Router();
  router.use(requireAuth);
  router.get("/:id", async (req, res) => {
    res.json(await getRevision(db, currentUser(req), revisionId(req.params.id)));
  });
  router.get("/:a/diff/:b", async (req, res) => {
    res.json(await diffRevisions(db, currentUser(req), revisionId(req.params.a), revisionId(req.params.b)));
  });
  router.post("/:id/rerun", async (req, res) => {
    const id = revisionId(req.params.id);
    const { parentRevision } = rerunRevisionSchema.parse(req.body ?? {});
    const user = currentUser(req);
    res.status(201).json(await rerunRevision(db, requestSweeps(sweeps, user, res), user, id, parentRevision, req.ip));
  });
  router.get("/:id/export", async (req, res) => {
    const file = await exportRevision(db, currentUser(req), revisionId(req.params.id));
    res.setHeader("X-Content-SHA256", file.sha256);
    res.attachment(file.fileName);
    res.type("application/json").send(file.text);
  });
  for (const format of ["csv", "json"] as const) {
    router.get(`/:id/steps.${format}`, async (req, res) => {
      await sendStepsTable(req, res, await revisionStepsTable(db, currentUser(req), revisionId(req.params.id)), format);
    });
  }
  return router;
}
